// The quote a client receives: lines from the quote version, tax, deposit and balance, validity.
import { Document, Page, Text, View } from "@react-pdf/renderer";
import { LineTable, StudioHeader, TaxByRateTable, Totals, styles, type DocLine, type DocStudio, type DocTaxRow } from "./parts";

export interface QuoteDocProps {
  studio: DocStudio;
  clientName: string;
  commissionTitle: string;
  commissionNumber: number;
  version: number;
  issuedOn: string;
  validUntil: string;
  lines: DocLine[];
  totals: { label: string; amount: string; strong?: boolean }[];
  taxNote: string;
  /** which labour figure the quote charges, in plain words (lib/core/pricing/labour-level.ts) */
  labourNote?: string | null;
  message: string;
  portalUrl: string;
  /** totals per tax rate, when the quote has more than one */
  taxByRate?: DocTaxRow[];
}

export function QuoteDocument(p: QuoteDocProps) {
  return (
    <Document title={`Quote ${p.commissionNumber}-${p.version}`} author={p.studio.name} language="en-GB">
      <Page size="A4" style={styles.page}>
        <StudioHeader studio={p.studio} title="Quote" subtitle={`No. ${p.commissionNumber}-${p.version} · issued ${p.issuedOn}`} />
        <View style={styles.block}>
          <Text style={styles.strong}>For {p.clientName}</Text>
          <Text>
            Commission {p.commissionNumber}: {p.commissionTitle}
          </Text>
          <Text>Valid until {p.validUntil}</Text>
        </View>
        {p.message ? <Text style={styles.block}>{p.message}</Text> : null}
        <LineTable lines={p.lines} />
        <Totals rows={p.totals} />
        {p.taxByRate ? <TaxByRateTable title="Tax by rate" rows={p.taxByRate} /> : null}
        {p.labourNote ? <Text style={[styles.block, styles.small]}>{p.labourNote}</Text> : null}
        <Text style={[styles.block, styles.small]}>{p.taxNote}</Text>
        <Text style={[styles.block, styles.small]}>
          Accept this quote or ask for changes in your portal: {p.portalUrl}. The deposit books the work; the balance is due when the piece is ready.
        </Text>
      </Page>
    </Document>
  );
}
