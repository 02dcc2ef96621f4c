import { requirePermission } from '@/lib/auth/session';
import { PageHeader } from '@/components/ui/page-header';
import { ImportWizard } from '@/components/supers/import-wizard';

export const metadata = { title: 'Import field sheet' };

export default async function ImportPage() {
  await requirePermission('supers.import', '/admin/supers/import');
  return (
    <>
      <PageHeader
        title="Import a field sheet"
        lead="Upload super pulls kept on paper or in a spreadsheet, saved as CSV. Every row is checked first; the valid rows are then imported together, all at once or not at all."
      />
      <ImportWizard />
    </>
  );
}
