// Shared pieces of the money documents (quote, invoice, receipt): header, line table, totals.
import { StyleSheet, Text, View } from "@react-pdf/renderer";
import { TEXT_FONTS, TITLE_FONTS } from "./fonts";

export interface DocStudio {
  name: string;
  address: string;
  contactEmail: string;
  taxNumber: string;
  brandHex: string;
}

export interface DocLine {
  label: string;
  amount: string;
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
        {studio.address ? <Text>{studio.address}</Text> : null}
        <Text>{studio.contactEmail}</Text>
        {studio.taxNumber ? <Text>Tax number: {studio.taxNumber}</Text> : null}
      </View>
    </View>
  );
}

export function LineTable({ lines }: { lines: DocLine[] }) {
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
