import type { Quote } from "@/lib/core/pricing/build-quote";
import { formatMoney } from "@/lib/core/pricing/format-money";

/** A quote's lines, tax, total, deposit and balance as an accessible table. */
export function QuoteLines({ quote, caption }: { quote: Quote; caption: string }) {
  const m = (n: number) => formatMoney(n, quote.currency);
  const rate = `${quote.taxRatePpm / 10_000} %`;
  return (
    <table className="w-full text-left">
      <caption className="mb-2 text-left text-bark">{caption}</caption>
      <thead>
        <tr>
          <th scope="col">Item</th>
          <th scope="col" className="text-right">
            Amount
          </th>
        </tr>
      </thead>
      <tbody>
        {quote.lines.map((l, i) => (
          <tr key={i} className="border-t border-bark/10">
            <td className="py-1">{l.label}</td>
            <td className="py-1 text-right tabular-nums">{m(l.amountMinor)}</td>
          </tr>
        ))}
      </tbody>
      <tfoot>
        {!quote.pricesIncludeTax ? (
          <tr className="border-t border-bark/30">
            <th scope="row" className="font-normal">
              Subtotal
            </th>
            <td className="text-right tabular-nums">{m(quote.subtotalMinor)}</td>
          </tr>
        ) : null}
        <tr>
          <th scope="row" className="font-normal">
            {quote.pricesIncludeTax ? `Tax included (${rate})` : `Tax (${rate})`}
          </th>
          <td className="text-right tabular-nums">{m(quote.taxMinor)}</td>
        </tr>
        <tr className="border-t border-bark/30 font-semibold">
          <th scope="row">Total</th>
          <td className="text-right tabular-nums">{m(quote.totalMinor)}</td>
        </tr>
        <tr>
          <th scope="row" className="font-normal">
            Deposit to book
          </th>
          <td className="text-right tabular-nums">{m(quote.depositMinor)}</td>
        </tr>
        <tr>
          <th scope="row" className="font-normal">
            Balance when ready
          </th>
          <td className="text-right tabular-nums">{m(quote.balanceMinor)}</td>
        </tr>
      </tfoot>
    </table>
  );
}
