import { requirePermission } from '@/lib/auth/session';
import { getSettings } from '@/lib/data/settings/settings';
import { PageHeader } from '@/components/ui/page-header';
import { Caution } from '@/components/ui/caution';
import { SettingsForm } from '@/components/settings/settings-form';
import { saveSettingsAction } from './actions';

export const metadata = { title: 'Settings' };

export default async function SettingsPage() {
  await requirePermission('settings.manage', '/admin/settings');
  const s = await getSettings();
  return (
    <>
      <PageHeader
        title="Settings"
        lead="What goes on labels, the limits lots are checked against, and how the shop sells."
      />
      <div className="mb-6">
        <Caution>
          Limits start at published honey standards (EU 2001/110/EC, USDA grades). Follow your own local food, labelling
          and weights-and-measures law; Combtrace records and warns, it does not certify.
        </Caution>
      </div>
      <SettingsForm
        onSave={saveSettingsAction}
        defaults={{
          businessName: s.businessName,
          address: s.address,
          region: s.region,
          contactEmail: s.contactEmail,
          story: s.story,
          publicLotNote: s.publicLotNote,
          timeZone: s.timeZone,
          currency: s.currency as 'usd',
          weightSystem: s.weightSystem,
          gs1CompanyPrefix: s.gs1CompanyPrefix,
          lotCodePrefix: s.lotCodePrefix,
          moistureLimitPct: s.moistureLimitPct,
          moistureLimitHeatherPct: s.moistureLimitHeatherPct,
          moistureGradeAPct: s.moistureGradeAPct,
          bestBeforeMonths: s.bestBeforeMonths,
          seasonStartMonth: s.seasonStartMonth,
          expectedLossPct: s.expectedLossPct,
          allowUntaggedSupers: s.allowUntaggedSupers,
          fillRuleSet: s.fillRuleSet,
          labelDeclaration: s.labelDeclaration,
          barcodeKind: s.barcodeKind,
        }}
      />
    </>
  );
}
