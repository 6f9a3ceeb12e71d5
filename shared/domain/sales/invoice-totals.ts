import { applyRate } from './money';

/**
 * How tax is rounded on an invoice. Both are lawful in the EU (Council Directive 2006/112/EC
 * leaves rounding to member states; most allow either — from memory), and they can differ by a
 * minor unit or two:
 * - `per_invoice` (our default): the lines' net amounts are added per tax rate and the tax on
 *   each sum is rounded once. Fewer roundings, the total is closest to the exact tax.
 * - `per_line`: each line's tax is rounded, and the invoice's tax is the sum of those.
 * Rounding is half away from zero to the currency's minor unit (`applyRate`).
 */
export type TaxRounding = 'per_invoice' | 'per_line';

export interface InvoiceLineInput {
  /** Price of one, in minor units, before tax. */
  unitPrice: number;
  quantity: number;
  /** Tax rate in basis points (2100 = 21 %); shipping may have its own. */
  taxBasisPoints: number;
}

export interface InvoiceLineTotal extends InvoiceLineInput {
  net: number;
  /** The line's own rounded tax (shown on the line under `per_line`, for reference otherwise). */
  tax: number;
}

export interface InvoiceTotals {
  lines: InvoiceLineTotal[];
  net: number;
  /** Tax per rate, ascending by rate: what an invoice lists. */
  taxByRate: { basisPoints: number; net: number; tax: number }[];
  tax: number;
  gross: number;
}

export function invoiceTotals(
  inputs: readonly InvoiceLineInput[],
  rounding: TaxRounding,
): InvoiceTotals {
  const lines = inputs.map((line) => {
    const net = line.unitPrice * line.quantity;
    return { ...line, net, tax: applyRate(net, line.taxBasisPoints) };
  });
  const byRate = new Map<number, { net: number; lineTax: number }>();
  for (const line of lines) {
    const sum = byRate.get(line.taxBasisPoints) ?? { net: 0, lineTax: 0 };
    sum.net += line.net;
    sum.lineTax += line.tax;
    byRate.set(line.taxBasisPoints, sum);
  }
  const taxByRate = [...byRate.entries()]
    .sort(([a], [b]) => a - b)
    .map(([basisPoints, sum]) => ({
      basisPoints,
      net: sum.net,
      tax: rounding === 'per_line' ? sum.lineTax : applyRate(sum.net, basisPoints),
    }));
  const net = lines.reduce((total, line) => total + line.net, 0);
  const tax = taxByRate.reduce((total, rate) => total + rate.tax, 0);
  return { lines, net, taxByRate, tax, gross: net + tax };
}
