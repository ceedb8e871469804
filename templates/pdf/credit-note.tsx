// A credit note for a refund: its own number, the document it corrects, and the amounts credited
// per tax rate (negative), so the client's and the studio's tax records both reverse exactly.
import { Document, Page, Text, View } from "@react-pdf/renderer";
import { StudioHeader, TaxByRateTable, Totals, styles, type DocStudio, type DocTaxRow } from "./parts";

export interface CreditNoteDocProps {
  /** e.g. "CRN-0003" */
  number: string;
  studio: DocStudio;
  clientName: string;
  clientAddress: string;
  commissionTitle: string;
  commissionNumber: number;
  issuedOn: string;
  /** the receipt or invoice corrected, e.g. "RCT-0012 of 2026-11-02" */
  corrects: string;
  reason: string;
  byRate: DocTaxRow[];
  totals: { label: string; amount: string; strong?: boolean }[];
}

export function CreditNoteDocument(p: CreditNoteDocProps) {
  return (
    <Document title={`Credit note ${p.number}`} author={p.studio.name} language="en-GB">
      <Page size="A4" style={styles.page}>
        <StudioHeader studio={p.studio} title="Credit note" subtitle={`${p.number} · issued ${p.issuedOn}`} />
        <View style={styles.block}>
          <Text style={styles.strong}>Credited to</Text>
          <Text>{p.clientName}</Text>
          {p.clientAddress ? <Text>{p.clientAddress}</Text> : null}
          <Text style={{ marginTop: 6 }}>
            Commission {p.commissionNumber}: {p.commissionTitle}
          </Text>
          <Text>Corrects {p.corrects}</Text>
          {p.reason ? <Text>Reason: {p.reason}</Text> : null}
        </View>
        <TaxByRateTable title="Credited by rate" rows={p.byRate} />
        <Totals rows={p.totals} />
        <Text style={[styles.block, styles.small]}>The amounts are negative: they reduce the amounts and the tax of the document corrected. The refund goes back to the card that paid.</Text>
      </Page>
    </Document>
  );
}
