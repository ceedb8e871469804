// Shared pieces of the money documents (quote, invoice, receipt): header, line table, totals.
import { StyleSheet, Text, View } from "@react-pdf/renderer";
import { TEXT_FONTS, TITLE_FONTS } from "./fonts";

export interface DocStudio {
  name: string;
  /** the legal name, when it differs from the trading name (VAT invoices name the seller) */
  legalName?: string;
  address: string;
  contactEmail: string;
  taxNumber: string;
  brandHex: string;
}

export interface DocLine {
  label: string;
  amount: string;
  /** VAT invoice columns; shown when any line has them */
  quantity?: string;
  unitPrice?: string;
  rate?: string;
}

/** One row of the tax-per-rate table: e.g. "Standard rate 20 %", net, tax, gross. */
export interface DocTaxRow {
  label: string;
  net: string;
  tax: string;
  gross: string;
}

export const styles = StyleSheet.create({
  page: { fontFamily: TEXT_FONTS, fontSize: 10, padding: 40, color: "#2B2622", lineHeight: 1.4 },
  title: { fontFamily: TITLE_FONTS, fontSize: 22, lineHeight: 1.3, marginBottom: 6 },
  muted: { color: "#5A4F45" },
  row: { flexDirection: "row", justifyContent: "space-between" },
  block: { marginTop: 16 },
  th: { fontWeight: 700, borderBottomWidth: 1, borderBottomColor: "#5A4F45", paddingBottom: 3, marginBottom: 3 },
  line: { flexDirection: "row", justifyContent: "space-between", paddingVertical: 2, borderBottomWidth: 0.5, borderBottomColor: "#D9D2C5" },
  total: { flexDirection: "row", justifyContent: "space-between", paddingVertical: 2 },
  strong: { fontWeight: 700 },
  small: { fontSize: 8, color: "#5A4F45" },
});

export function StudioHeader({ studio, title, subtitle }: { studio: DocStudio; title: string; subtitle: string }) {
  return (
    <View style={styles.row}>
      <View>
        <Text style={[styles.title, { color: studio.brandHex }]}>{title}</Text>
        <Text style={styles.muted}>{subtitle}</Text>
      </View>
      <View style={{ alignItems: "flex-end", maxWidth: 220 }}>
        <Text style={styles.strong}>{studio.name}</Text>
        {studio.legalName && studio.legalName !== studio.name ? <Text>{studio.legalName}</Text> : null}
        {studio.address ? <Text>{studio.address}</Text> : null}
        <Text>{studio.contactEmail}</Text>
        {studio.taxNumber ? <Text>VAT / tax number: {studio.taxNumber}</Text> : null}
      </View>
    </View>
  );
}

const cell = { qty: { width: 70, textAlign: "right" as const }, unit: { width: 70, textAlign: "right" as const }, rate: { width: 110, textAlign: "right" as const }, amount: { width: 70, textAlign: "right" as const } };

export function LineTable({ lines }: { lines: DocLine[] }) {
  if (lines.some((l) => l.rate !== undefined || l.quantity !== undefined)) {
    return (
      <View style={styles.block}>
        <View style={[styles.row, styles.th]}>
          <Text style={{ flex: 1 }}>Item</Text>
          <Text style={cell.qty}>Quantity</Text>
          <Text style={cell.unit}>Unit price</Text>
          <Text style={cell.rate}>Tax rate</Text>
          <Text style={cell.amount}>Amount</Text>
        </View>
        {lines.map((l, i) => (
          <View key={i} style={styles.line}>
            <Text style={{ flex: 1 }}>{l.label}</Text>
            <Text style={cell.qty}>{l.quantity ?? ""}</Text>
            <Text style={cell.unit}>{l.unitPrice ?? ""}</Text>
            <Text style={[cell.rate, styles.small]}>{l.rate ?? ""}</Text>
            <Text style={cell.amount}>{l.amount}</Text>
          </View>
        ))}
      </View>
    );
  }
  return (
    <View style={styles.block}>
      <View style={[styles.row, styles.th]}>
        <Text>Item</Text>
        <Text>Amount</Text>
      </View>
      {lines.map((l, i) => (
        <View key={i} style={styles.line}>
          <Text style={{ maxWidth: 380 }}>{l.label}</Text>
          <Text>{l.amount}</Text>
        </View>
      ))}
    </View>
  );
}

export function Totals({ rows }: { rows: { label: string; amount: string; strong?: boolean }[] }) {
  return (
    <View style={[styles.block, { marginLeft: 240 }]}>
      {rows.map((r, i) => (
        <View key={i} style={styles.total}>
          <Text style={r.strong ? styles.strong : undefined}>{r.label}</Text>
          <Text style={r.strong ? styles.strong : undefined}>{r.amount}</Text>
        </View>
      ))}
    </View>
  );
}

/** Totals per tax rate (they add up to the document's totals). */
export function TaxByRateTable({ title, rows }: { title: string; rows: DocTaxRow[] }) {
  if (!rows.length) return null;
  return (
    <View style={styles.block}>
      <Text style={styles.strong}>{title}</Text>
      <View style={[styles.row, styles.th]}>
        <Text style={{ flex: 1 }}>Rate</Text>
        <Text style={cell.unit}>Net</Text>
        <Text style={cell.unit}>Tax</Text>
        <Text style={cell.unit}>Total</Text>
      </View>
      {rows.map((r, i) => (
        <View key={i} style={styles.line}>
          <Text style={{ flex: 1 }}>{r.label}</Text>
          <Text style={cell.unit}>{r.net}</Text>
          <Text style={cell.unit}>{r.tax}</Text>
          <Text style={cell.unit}>{r.gross}</Text>
        </View>
      ))}
    </View>
  );
}
