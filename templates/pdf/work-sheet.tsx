// The work sheet a maker prints: per chart, the chart with symbols and its colour key, the knitted
// pair, float catches per row, and for every darned colour a numbered route map with ends and yarn;
// first, when the commission has saved sizing, its recipe in metric and imperial.
import { Document, Image, Page, StyleSheet, Text, View } from "@react-pdf/renderer";
import { TEXT_FONTS, TITLE_FONTS } from "./fonts";
import type { ReactNode } from "react";

export interface WorkSheetColourKey {
  key: string;
  name: string;
  hex: string;
  stitches: number;
  /** "knitted" or "darned" */
  role: string;
}

export interface WorkSheetDarnedColour {
  key: string;
  name: string;
  stitches: number;
  strands: { from: string; to: string; stitches: number; carryCm: number }[];
  ends: number;
  carryCm: number;
  yarnCm: number;
  minutes: number;
  /** where the map sits on the chart, e.g. "rows 14 to 22, stitches 9 to 21" */
  mapArea: string;
  /** PNG data URL of the numbered route map */
  mapPng: string;
}

export interface WorkSheetChart {
  label: string;
  size: string;
  gauge: string;
  /** PNG data URL of the chart with symbols, numbers and key */
  chartPng: string;
  key: WorkSheetColourKey[];
  knit: string;
  darn: string;
  floatRule: string;
  catchRows: { row: number; longestFloat: number; catches: number; behind: string }[];
  totalCatches: number;
  darned: WorkSheetDarnedColour[];
  totals: { stitches: number; ends: number; endsBound: number; carryCm: number; yarnCm: number; minutes: number; savedEnds: number; savedMinutes: number };
}

export interface WorkSheetRecipe {
  /** e.g. "Cast on 160 sts; size woman; 32 sts and 36 rnds per 10 cm" */
  summary: string;
  metric: string[];
  imperial: string[];
  warnings: string[];
}

/** The whole garment with the design on it (lib/server/garment.ts): every piece, and round by round what is knitted and darned. */
export interface WorkSheetGarment {
  /** e.g. "sized from the saved sizing, size child, 30 sts and 34 rnds per 10 cm" */
  summary: string;
  note: string | null;
  problems: string | null;
  pieces: { name: string; stitches: number; plain: number; stranded: number; darned: number; catches: number; ends: number }[];
  /** the first piece's rounds (a pair's second piece is knitted the same way, or mirrored), runs of equal rounds merged */
  roundsOf: string;
  rounds: { part: string; rounds: string; knit: string; darned: number; why: string }[];
}

export interface WorkSheetProps {
  studioName: string;
  /** every piece of the garment, when the design belongs to a commission */
  garment?: WorkSheetGarment | null;
  /** the commission's saved sizing, when there is one: printed first */
  recipe?: WorkSheetRecipe | null;
  title: string;
  commission: string;
  version: number;
  printedOn: string;
  charts: WorkSheetChart[];
}

const styles = StyleSheet.create({
  page: { fontFamily: TEXT_FONTS, fontSize: 10, padding: 36, color: "#222222", lineHeight: 1.35 },
  h1: { fontFamily: TITLE_FONTS, fontSize: 18, lineHeight: 1.3, marginBottom: 4 },
  h2: { fontFamily: TITLE_FONTS, fontSize: 14, marginTop: 10, marginBottom: 4 },
  h3: { fontWeight: 700, fontSize: 11, marginTop: 8, marginBottom: 3 },
  small: { fontSize: 8.5, color: "#555555" },
  row: { flexDirection: "row", borderBottomWidth: 0.5, borderBottomColor: "#BBBBBB", paddingVertical: 2 },
  head: { flexDirection: "row", borderBottomWidth: 1, borderBottomColor: "#555555", paddingVertical: 2, fontWeight: 700 },
  swatch: { width: 10, height: 10, borderWidth: 0.5, borderColor: "#333333", marginRight: 4 },
  block: { marginTop: 6 },
  strong: { fontWeight: 700 },
});

const fmt = (n: number) => n.toLocaleString("en-GB", { maximumFractionDigits: 1 });

function Cell({ w, children, bold }: { w: number; children: ReactNode; bold?: boolean }) {
  return <Text style={{ width: w, ...(bold ? { fontWeight: 700 } : {}) }}>{children}</Text>;
}

/** Repeated at the top of every page: studio, commission and page number. */
function SheetHeader({ p }: { p: WorkSheetProps }) {
  return (
    <View fixed style={{ flexDirection: "row", justifyContent: "space-between", marginBottom: 6 }}>
      <Text style={styles.small}>
        {p.studioName} · work sheet · {p.commission}
      </Text>
      <Text style={styles.small} render={({ pageNumber, totalPages }) => `page ${pageNumber} of ${totalPages}`} />
    </View>
  );
}

export function WorkSheetDocument(p: WorkSheetProps) {
  return (
    <Document title={`Work sheet: ${p.title}`} author={p.studioName} language="en-GB">
      {p.recipe ? (
        <Page size="A4" style={styles.page} wrap>
          <SheetHeader p={p} />
          <Text style={styles.h1}>{p.title}: recipe</Text>
          <Text style={styles.small}>
            Version {p.version} · printed {p.printedOn} · {p.recipe.summary}
          </Text>
          {p.recipe.warnings.map((w, i) => (
            <Text key={`w${i}`} style={styles.block}>
              {`Note: ${w}`}
            </Text>
          ))}
          <Text style={styles.h2}>Metric</Text>
          {p.recipe.metric.map((l, i) => (
            <Text key={`m${i}`} style={{ marginBottom: 2 }}>{`${i + 1}. ${l}`}</Text>
          ))}
          <Text style={styles.h2}>Imperial</Text>
          {p.recipe.imperial.map((l, i) => (
            <Text key={`i${i}`} style={{ marginBottom: 2 }}>{`${i + 1}. ${l}`}</Text>
          ))}
        </Page>
      ) : null}
      {p.garment ? (
        <Page size="A4" style={styles.page} wrap>
          <SheetHeader p={p} />
          <Text style={styles.h1}>{p.title}: the garment</Text>
          <Text style={styles.small}>
            Version {p.version} · printed {p.printedOn} · {p.garment.summary}
          </Text>
          {p.garment.note ? <Text style={styles.block}>{`Note: ${p.garment.note}`}</Text> : null}
          {p.garment.problems ? <Text style={styles.block}>{p.garment.problems}</Text> : null}
          <Text style={styles.h2}>Pieces: every stitch</Text>
          <View style={styles.head}>
            <Cell w={130}>Piece</Cell>
            <Cell w={70}>Stitches</Cell>
            <Cell w={70}>Plain</Cell>
            <Cell w={70}>Stranded</Cell>
            <Cell w={60}>Darned</Cell>
            <Cell w={60}>Catches</Cell>
            <Cell w={50}>Ends</Cell>
          </View>
          {p.garment.pieces.map((x) => (
            <View key={x.name} style={styles.row} wrap={false}>
              <Cell w={130}>{x.name}</Cell>
              <Cell w={70}>{fmt(x.stitches)}</Cell>
              <Cell w={70}>{fmt(x.plain)}</Cell>
              <Cell w={70}>{fmt(x.stranded)}</Cell>
              <Cell w={60}>{fmt(x.darned)}</Cell>
              <Cell w={60}>{fmt(x.catches)}</Cell>
              <Cell w={50}>{fmt(x.ends)}</Cell>
            </View>
          ))}
          <Text style={styles.h2}>Round by round: {p.garment.roundsOf}</Text>
          <Text style={styles.small}>At most two colours are knitted in a round; darned colours are knitted in the round's colours first and embroidered afterwards.</Text>
          <View style={styles.head}>
            <Cell w={80}>Part</Cell>
            <Cell w={60}>Rounds</Cell>
            <Cell w={130}>Knitted</Cell>
            <Cell w={50}>Darned</Cell>
            <Cell w={200}>Why</Cell>
          </View>
          {p.garment.rounds.map((r, i) => (
            <View key={`r${i}`} style={styles.row} wrap={false}>
              <Cell w={80}>{r.part}</Cell>
              <Cell w={60}>{r.rounds}</Cell>
              <Cell w={130}>{r.knit}</Cell>
              <Cell w={50}>{r.darned ? fmt(r.darned) : ""}</Cell>
              <Cell w={200}>{r.why}</Cell>
            </View>
          ))}
        </Page>
      ) : null}
      {p.charts.map((c, ci) => (
        <Page key={ci} size="A4" style={styles.page} wrap>
          <SheetHeader p={p} />
          <Text style={styles.h1}>
            {p.title}: {c.label}
          </Text>
          <Text style={styles.small}>
            Version {p.version} · printed {p.printedOn} · {c.size} · {c.gauge}
          </Text>
          <Text style={styles.block}>
            Rows are numbered from the bottom and stitches from the right, as knitted. Each colour has its own symbol, so the chart reads in black and white.
          </Text>
          <Image src={c.chartPng} style={{ marginTop: 6, maxHeight: 420, objectFit: "contain" }} />

          <Text style={styles.h2}>Colour key</Text>
          <View style={styles.head}>
            <Cell w={40}>Key</Cell>
            <Cell w={170}>Colour</Cell>
            <Cell w={80}>Hex</Cell>
            <Cell w={70}>Stitches</Cell>
            <Cell w={100}>Worked by</Cell>
          </View>
          {c.key.map((k) => (
            <View key={k.key} style={styles.row}>
              <View style={{ width: 40, flexDirection: "row" }}>
                <View style={[styles.swatch, { backgroundColor: k.hex }]} />
                <Text>{k.key}</Text>
              </View>
              <Cell w={170}>{k.name}</Cell>
              <Cell w={80}>{k.hex}</Cell>
              <Cell w={70}>{k.stitches}</Cell>
              <Cell w={100}>{k.role}</Cell>
            </View>
          ))}

          <Text style={styles.h2}>Knitted pair</Text>
          <Text>Knit in {c.knit}.</Text>
          <Text>{c.darn}</Text>

          <Text style={styles.h2}>Float catches per row</Text>
          <Text style={styles.small}>{c.floatRule}</Text>
          {c.catchRows.length ? (
            <View style={styles.block}>
              <View style={styles.head}>
                <Cell w={60}>Row</Cell>
                <Cell w={90}>Longest float</Cell>
                <Cell w={70}>Catches</Cell>
                <Cell w={290}>Catch behind stitches</Cell>
              </View>
              {c.catchRows.map((r) => (
                <View key={r.row} style={styles.row} wrap={false}>
                  <Cell w={60}>{`Row ${r.row}`}</Cell>
                  <Cell w={90}>{`${r.longestFloat} sts`}</Cell>
                  <Cell w={70}>{r.catches}</Cell>
                  <Cell w={290}>{r.behind}</Cell>
                </View>
              ))}
              <Text style={styles.block}>{`${c.totalCatches} catches in all.`}</Text>
            </View>
          ) : (
            <Text style={styles.block}>No float is over the limit: no catches needed.</Text>
          )}

          <Text style={styles.h2}>Duplicate stitch</Text>
          {c.darned.length === 0 ? <Text>Nothing to darn: every stitch is knitted.</Text> : null}
          {c.darned.map((d) => (
            <View key={d.key} break={c.darned.length > 0} style={{ marginTop: 4 }}>
              <Text style={styles.h3}>{`Darning ${d.name} (${d.key}): ${d.stitches} stitches`}</Text>
              <Text>
                {`${d.strands.length} strand${d.strands.length === 1 ? "" : "s"} · ${d.ends} ends to weave in · ${fmt(d.carryCm)} cm carried · yarn ${fmt(d.yarnCm)} cm (${fmt(d.yarnCm / 100)} m) · about ${fmt(d.minutes)} minutes`}
              </Text>
              <Text style={styles.small}>
                The map shows {d.mapArea}. Work the stitches in the order numbered. A ring marks a strand&apos;s first stitch, a square its last; dashed lines are yarn carried on the wrong side.
              </Text>
              <Image src={d.mapPng} style={{ marginTop: 4, maxHeight: 480, objectFit: "contain" }} />
              {d.strands.map((s, i) => (
                <Text key={i} style={styles.small}>
                  {`Strand ${i + 1}: from ${s.from} to ${s.to}, ${s.stitches} stitches, ${fmt(s.carryCm)} cm carried`}
                </Text>
              ))}
            </View>
          ))}
          <View style={styles.block} wrap={false}>
            <Text style={styles.h3}>Totals for {c.label}</Text>
            <Text>
              {`Darned stitches ${c.totals.stitches} · ends ${c.totals.ends} (fewest possible ${c.totals.endsBound}) · carried ${fmt(c.totals.carryCm)} cm · darning yarn ${fmt(c.totals.yarnCm)} cm · about ${fmt(c.totals.minutes)} minutes`}
            </Text>
            <Text>{`Saved versus row by row: ${c.totals.savedEnds} ends and ${fmt(c.totals.savedMinutes)} minutes.`}</Text>
          </View>
        </Page>
      ))}
    </Document>
  );
}
