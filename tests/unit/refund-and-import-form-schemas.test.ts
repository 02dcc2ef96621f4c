import { describe, expect, it } from 'vitest';
import { refundFormInput, refundInput } from '@/lib/schemas/orders';
import { importSheetInput } from '@/lib/schemas/supers';

describe('the refund form reads the amount as typed', () => {
  const typed = { orderId: 7, jars: [{ lineId: 1, quantity: 1 }], restock: true, reason: '' };
  it('a decimal comma reads as a point, and the result passes the action’s schema', () => {
    const sent = refundFormInput.parse({ ...typed, amount: ' 12,50 ' });
    expect(sent.amount).toBe(12.5);
    expect(refundInput.safeParse(sent).success).toBe(true);
  });
  it('a blank or a word is no amount, and zero is refused', () => {
    for (const amount of ['', 'twelve'])
      expect(refundFormInput.safeParse({ ...typed, amount }).error?.issues[0]?.message).toBe(
        'Enter the amount to refund',
      );
    expect(refundFormInput.safeParse({ ...typed, amount: '0' }).error?.issues[0]?.message).toBe('More than zero');
  });
});

describe('the pull import checks the chosen file before posting it', () => {
  const sheet = (name: string, bytes = 10) => new File(['x'.repeat(bytes)], name, { type: 'text/csv' });
  it('takes a CSV file for a preview', () => {
    expect(importSheetInput.safeParse({ file: sheet('field-sheet.CSV'), mode: 'preview' }).success).toBe(true);
  });
  it('refuses another kind of file and a file over 5 MB, with the wizard’s words', () => {
    expect(
      importSheetInput.safeParse({ file: sheet('field-sheet.xlsx'), mode: 'preview' }).error?.issues[0]?.message,
    ).toMatch(/^Only CSV files \(\.csv\) can be imported/);
    expect(
      importSheetInput.safeParse({ file: sheet('big.csv', 5 * 1024 * 1024 + 1), mode: 'preview' }).error?.issues[0]
        ?.message,
    ).toBe('The file is larger than 5 MB. Split it into smaller files.');
  });
});
