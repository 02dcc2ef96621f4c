import { requirePermission } from '@/lib/auth/session';
import { listStaff } from '@/lib/data/staff/users';
import { PageHeader } from '@/components/ui/page-header';
import { Chip } from '@/components/ui/chip';
import { StaffForm } from '@/components/staff/staff-form';
import { StaffRowActions } from '@/components/staff/staff-row-actions';
import { createStaffAction, updateStaffAction } from './actions';
import { TableHead } from '@/components/ui/table-parts';

export const metadata = { title: 'Staff' };

export default async function StaffPage() {
  const me = await requirePermission('staff.manage', '/admin/staff');
  const staff = await listStaff();
  return (
    <>
      <PageHeader title="Staff" lead="New staff get an e-mail with a link to choose their password." />
      <div className="grid gap-6 xl:grid-cols-[1fr_22rem]">
        <div className="overflow-x-auto card p-0">
          <table className="data-table">
            <caption className="sr-only">Staff accounts</caption>
            <TableHead columns={['Name', 'E-mail', 'Role', 'Status', { label: 'Actions', hidden: true }]} />
            <tbody>
              {staff.map((s) => (
                <tr key={s.id}>
                  <td>{s.name}</td>
                  <td className="break-all">{s.email}</td>
                  <td className="capitalize">{s.role === 'crew' ? 'honey house' : s.role}</td>
                  <td>{s.disabled ? <Chip tone="bad">disabled</Chip> : <Chip tone="ok">active</Chip>}</td>
                  <td>
                    {s.id === me.id ? (
                      <span className="hint">you</span>
                    ) : (
                      <StaffRowActions
                        userId={s.id}
                        role={s.role as 'owner'}
                        disabled={s.disabled}
                        onUpdate={updateStaffAction}
                      />
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <section className="card">
          <h2 className="mb-3">Add a staff member</h2>
          <StaffForm onCreate={createStaffAction} />
        </section>
      </div>
    </>
  );
}
