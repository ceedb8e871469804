// The care card that goes with a finished piece: washing and drying for its fibre, re-blocking,
// and the cautions for its garment, wearer and fibre, each with its source. Content comes from
// lib/core/production/care.ts (cautions: lib/core/safety).
import { Document, Page, StyleSheet, Text, View } from "@react-pdf/renderer";
import { TEXT_FONTS, TITLE_FONTS } from "./fonts";
import type { CareCard } from "@/lib/core/production";

const s = StyleSheet.create({
  page: { fontFamily: TEXT_FONTS, fontSize: 11, padding: 36, color: "#2B2622", lineHeight: 1.45 },
  // The page's line height would be taken in points of the body size: a title states its own.
  title: { fontFamily: TITLE_FONTS, fontSize: 20, lineHeight: 1.3, marginBottom: 6 },
  muted: { color: "#5A4F45" },
  heading: { fontWeight: 700, fontSize: 12, marginTop: 14, marginBottom: 4 },
  line: { flexDirection: "row", marginBottom: 3 },
  bullet: { width: 12 },
  text: { flex: 1 },
  footer: { marginTop: 18, fontSize: 9, color: "#5A4F45" },
  // Compact: a child's card can carry seven cautions, and the card should stay short.
  caution: { marginBottom: 4, fontSize: 9.5, lineHeight: 1.35 },
  cautionTitle: { fontWeight: 700 },
  source: { fontSize: 7.5, color: "#5A4F45" },
});

export interface CareCardProps {
  studio: { name: string; contactEmail: string; brandHex: string };
  piece: { title: string; clientName: string; yarns: string[] };
  card: CareCard;
}

export function CareCardDocument({ studio, piece, card }: CareCardProps) {
  return (
    <Document title={`Care card: ${piece.title}`} author={studio.name}>
      <Page size="A5" style={s.page}>
        <Text style={[s.title, { color: studio.brandHex }]}>Caring for your knitting</Text>
        <Text style={s.muted}>
          {piece.title}, knitted for {piece.clientName} by {studio.name}
        </Text>
        {piece.yarns.length ? <Text style={s.muted}>Yarn: {piece.yarns.join("; ")}</Text> : null}
        {card.sections.map((section) => (
          <View key={section.heading} wrap={false}>
            <Text style={s.heading}>{section.heading}</Text>
            {section.lines.map((line, i) => (
              <View key={i} style={s.line}>
                <Text style={s.bullet}>•</Text>
                <Text style={s.text}>{line}</Text>
              </View>
            ))}
          </View>
        ))}
        {card.cautions.length ? (
          <View>
            <Text style={s.heading}>{card.ageBand === "adult" ? "Good to know" : "Safety for children"}</Text>
            {card.cautions.map((c) => (
              <View key={c.id} style={s.caution} wrap={false}>
                <Text>
                  <Text style={s.cautionTitle}>{c.title}. </Text>
                  {c.text}
                </Text>
                <Text style={s.source}>Source: {c.source}.</Text>
              </View>
            ))}
          </View>
        ) : null}
        <Text style={s.footer}>Questions or a repair? Write to {studio.contactEmail}. Hand-knitted pieces can usually be mended.</Text>
      </Page>
    </Document>
  );
}
