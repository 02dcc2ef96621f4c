import { authorize } from '@/lib/auth/session';
import { getLotCode, getRecallList } from '@/lib/data/trace/trace';
import { getSettings } from '@/lib/data/settings/settings';
import { toCsv } from '@/lib/domain/csv';
import { handleRouteError, HttpError } from '@/lib/http/json';
import { pdfResponse } from '@/lib/pdf/response';
import { renderTableReport } from '@/lib/pdf/table-report';
import { idParam, recallFormat } from '@/lib/schemas/reports';

export const dynamic = 'force-dynamic';

const COLUMNS = ['Order', 'Status', 'Customer', 'E-mail', 'Phone', 'Address', 'Lot', 'Product', 'Jars', 'Paid on'];

/** Recall list for a lot (and blends made from it): every customer who received its jars, as CSV or PDF (?lot=ID&format=csv|pdf). */
export async function GET(req: Request) {
  try {
    await authorize('trace.read');
    const params = new URL(req.url).searchParams;
    const lotId = idParam.safeParse(params.get('lot'));
    if (!lotId.success) throw new HttpError(400, 'Say which lot (?lot=…).');
    const format = recallFormat.parse(params.get('format') ?? 'csv');
    const code = await getLotCode(lotId.data);
    if (!code) throw new HttpError(404, 'There is no such lot.');
    const rows = await getRecallList(lotId.data);
    const cells = rows.map((r) => [
      r.orderNumber,
      r.status.replace('_', ' '),
      r.customerName,
      r.email,
      r.phone,
      r.address,
      r.lotCode,
      r.productName,
      r.jars,
      r.paidAt ?? '',
    ]);
    if (format === 'csv') {
      return new Response(`\uFEFF${toCsv(COLUMNS, cells)}\r\n`, {
        headers: {
          'Content-Type': 'text/csv; charset=utf-8',
          'Content-Disposition': `attachment; filename="recall-${code.replace(/[^A-Za-z0-9-]/g, '_')}.csv"`,
          'Cache-Control': 'private, no-store',
          'X-Content-Type-Options': 'nosniff',
        },
      });
    }
    const settings = await getSettings();
    const jars = rows.reduce((a, r) => a + r.jars, 0);
    const bytes = await renderTableReport({
      title: `Recall list: lot ${code}`,
      subtitle: `${settings.businessName}. ${new Set(rows.map((r) => r.email)).size} customers, ${jars} jars, from lot ${code} and any blend made from it.`,
      sections: [{ heading: 'Customers who received jars', columns: COLUMNS, rows: cells.map((r) => r.map(String)) }],
      footer: `${settings.businessName} · recall list · lot ${code} · personal data: keep private`,
    });
    return pdfResponse(bytes, `recall-${code}`);
  } catch (err) {
    return handleRouteError(err);
  }
}
