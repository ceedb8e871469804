// Invoices and receipts: studio and tax number, client, commission, the accepted quote's lines,
// tax, deposit paid, balance due or paid, due date and payment link.
import { Document, Link, Page, Text, View } from "@react-pdf/renderer";
import { LineTable, StudioHeader, TaxByRateTable, Totals, styles, type DocLine, type DocStudio, type DocTaxRow } from "./parts";

export interface InvoiceDocProps {
  kind: "invoice" | "receipt";
  /** e.g. "INV-0007" */
  number: string;
  studio: DocStudio;
  clientName: string;
  clientAddress: string;
  commissionTitle: string;
  commissionNumber: number;
  quoteVersion: number;
  issuedOn: string;
  dueDate: string | null;
  lines: DocLine[];
  totals: { label: string; amount: string; strong?: boolean }[];
  taxNote: string;
  payUrl: string | null;
  paidNote: string | null;
  /** date of supply / tax point, when it differs from the date of issue or must be stated */
  supplyDate?: string | null;
  /** totals per rate of the whole supply */
  taxByRate?: DocTaxRow[];
  /** the part this receipt acknowledges, per rate with the tax within it (a deposit is a tax point) */
  receivedByRate?: DocTaxRow[];
}

export function InvoiceDocument(p: InvoiceDocProps) {
  const title = p.kind === "invoice" ? "Invoice" : "Receipt";
  return (
    <Document title={`${title} ${p.number}`} author={p.studio.name} language="en-GB">
      <Page size="A4" style={styles.page}>
        <StudioHeader studio={p.studio} title={title} subtitle={`${p.number} · issued ${p.issuedOn}`} />
        <View style={styles.block}>
          <Text style={styles.strong}>{p.kind === "invoice" ? "Bill to" : "Received from"}</Text>
          <Text>{p.clientName}</Text>
          {p.clientAddress ? <Text>{p.clientAddress}</Text> : null}
          <Text style={{ marginTop: 6 }}>
            Commission {p.commissionNumber}: {p.commissionTitle} (quote version {p.quoteVersion})
          </Text>
          {p.dueDate ? <Text>Due by {p.dueDate}</Text> : null}
        </View>
        {p.supplyDate ? <Text>{p.kind === "receipt" ? "Tax point (date received)" : "Date of supply"}: {p.supplyDate}</Text> : null}
        <LineTable lines={p.lines} />
        <Totals rows={p.totals} />
        {p.taxByRate ? <TaxByRateTable title="Tax by rate" rows={p.taxByRate} /> : null}
        {p.receivedByRate ? <TaxByRateTable title="This payment by rate, tax within it" rows={p.receivedByRate} /> : null}
        <Text style={[styles.block, styles.small]}>{p.taxNote}</Text>
        {p.paidNote ? <Text style={styles.block}>{p.paidNote}</Text> : null}
        {p.payUrl ? (
          <Text style={styles.block}>
            Pay online: <Link src={p.payUrl}>{p.payUrl}</Link>
          </Text>
        ) : null}
      </Page>
    </Document>
  );
}
