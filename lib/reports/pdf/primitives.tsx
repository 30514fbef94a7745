import { Text, View } from "@react-pdf/renderer";
import type { ReactNode } from "react";
import { pdfText } from "./glyphs";
import { COLORS, S, type Style } from "./theme";

/** Text whose string children are mapped onto the glyphs the shipped fonts have. */
export function T({
  children,
  style,
  fixed,
}: {
  children: ReactNode;
  style?: Style | Style[];
  fixed?: boolean;
}) {
  const map = (c: ReactNode): ReactNode =>
    typeof c === "string" ? pdfText(c) : Array.isArray(c) ? c.map(map) : c;
  // react-pdf turns a unitless lineHeight into points with the element's OWN fontSize (18 when it has
  // none) and children inherit those points, so line height is set here, in points, only where the
  // font size is known; elsewhere the font's natural line height (about 1.3) applies.
  const list = Array.isArray(style) ? style : style ? [style] : [];
  const fontSize = list.reduce<number | undefined>(
    (fs, st) => (typeof st?.fontSize === "number" ? st.fontSize : fs),
    undefined,
  );
  const withLead =
    fontSize !== undefined && !list.some((st) => st?.lineHeight !== undefined)
      ? [...list, { lineHeight: 1.35 }]
      : list;
  return (
    <Text style={withLead} {...(fixed ? { fixed: true } : {})}>
      {map(children)}
    </Text>
  );
}

export function H1({ children }: { children: string }) {
  return <T style={S.h1}>{children}</T>;
}

export function H2({ children, kicker }: { children: string; kicker?: string }) {
  return (
    <View minPresenceAhead={60} wrap={false}>
      {kicker ? <T style={[S.kicker, { marginTop: 10 }]}>{kicker}</T> : null}
      <T style={kicker ? [S.h2, { marginTop: 0 }] : S.h2}>{children}</T>
    </View>
  );
}

export function H3({ children }: { children: string }) {
  return (
    <View minPresenceAhead={40} wrap={false}>
      <T style={S.h3}>{children}</T>
    </View>
  );
}

export function P({ children, style }: { children: ReactNode; style?: Style }) {
  return <T style={style ? [S.p, style] : S.p}>{children}</T>;
}

export function Note({ children, tone = "note" }: { children: ReactNode; tone?: "note" | "caution" }) {
  return (
    <View style={tone === "caution" ? S.caution : S.note} wrap={false}>
      {typeof children === "string" ? <T>{children}</T> : children}
    </View>
  );
}

export interface Column<R> {
  title: string;
  /** Unit line under the title. */
  unit?: string;
  /** Flex weight of the column. */
  width: number;
  align?: "left" | "right";
  cell: (row: R) => string;
  /** Bold / coloured cell. */
  emphasis?: (row: R) => boolean;
}

/**
 * A table that breaks across pages cleanly: rows never split (wrap={false}) and the header row is
 * `fixed`, so it is repeated at the top of every page the table continues on.
 */
export function Table<R>({
  columns,
  rows,
  totals,
  fontSize,
  zebra = true,
}: {
  columns: Column<R>[];
  rows: R[];
  totals?: R[];
  fontSize?: number;
  zebra?: boolean;
}) {
  const cellStyle = (c: Column<R>): Style[] => {
    const st: Style[] = [S.td, { flex: c.width }];
    if (c.align === "right") st.push(S.num);
    if (fontSize) st.push({ fontSize });
    return st;
  };
  return (
    <View style={S.table}>
      <View style={S.th} fixed>
        {columns.map((c, i) => (
          <View key={i} style={[S.td, { flex: c.width }]}>
            <T style={c.align === "right" ? { textAlign: "right" } : {}}>{c.title}</T>
            {c.unit ? (
              <T
                style={[
                  { fontWeight: 400, color: COLORS.inkFaint, fontSize: 6.5 },
                  c.align === "right" ? { textAlign: "right" } : {},
                ]}
              >
                {c.unit}
              </T>
            ) : null}
          </View>
        ))}
      </View>
      {rows.map((r, i) => (
        <View key={i} style={[S.tr, zebra && i % 2 === 1 ? { backgroundColor: "#f8fafb" } : {}]} wrap={false}>
          {columns.map((c, j) => (
            <T
              key={j}
              style={[...cellStyle(c), c.emphasis?.(r) ? { fontWeight: 600, color: COLORS.basin700 } : {}]}
            >
              {c.cell(r)}
            </T>
          ))}
        </View>
      ))}
      {(totals ?? []).map((r, i) => (
        <View key={`t${i}`} style={S.trTotal} wrap={false}>
          {columns.map((c, j) => (
            <T key={j} style={[...cellStyle(c), { fontWeight: c.align === "right" ? 500 : 600 }]}>
              {c.cell(r)}
            </T>
          ))}
        </View>
      ))}
    </View>
  );
}

/** A two-column list of label → value, for the cover and short facts. */
export function Facts({ items, labelWidth = 110 }: { items: [string, string][]; labelWidth?: number }) {
  return (
    <View>
      {items.map(([k, v], i) => (
        <View
          key={i}
          style={{
            flexDirection: "row",
            paddingVertical: 3,
            borderBottomWidth: 0.4,
            borderBottomColor: COLORS.line,
          }}
          wrap={false}
        >
          <T style={{ width: labelWidth, color: COLORS.inkFaint, fontSize: 8 }}>{k}</T>
          <T style={{ flex: 1 }}>{v}</T>
        </View>
      ))}
    </View>
  );
}
