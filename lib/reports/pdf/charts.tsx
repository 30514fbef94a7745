/**
 * Vector charts for the PDF, drawn with react-pdf's Svg primitives (no raster images, no chart library):
 * cost stack, cumulative discounted cost, monthly water, tornado and the Monte Carlo distribution.
 * Each takes plain numbers already in the viewer's units and money, and draws at a fixed size in points.
 */
import { G, Line, Path, Rect, Svg, Text as SvgText, View } from "@react-pdf/renderer";
import { fmtMoneyShort, fmtNumber } from "../format";
import { pdfText } from "./glyphs";
import { T } from "./primitives";
import { COLORS } from "./theme";

const AXIS = COLORS.lineStrong;
const GRID = "#e6ecf0";
const LABEL = COLORS.inkSoft;
const FONT = { fontFamily: "Plex Sans", fontSize: 6.5 } as const;

/** "Nice" axis ticks covering [min, max] (1-2-5 steps). */
export function niceTicks(min: number, max: number, target = 5): number[] {
  if (!Number.isFinite(min) || !Number.isFinite(max)) return [0];
  if (min === max) {
    const pad = Math.abs(min) > 0 ? Math.abs(min) * 0.1 : 1;
    min -= pad;
    max += pad;
  }
  const raw = (max - min) / Math.max(1, target);
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = ([1, 2, 2.5, 5, 10].find((m) => m * mag >= raw) ?? 10) * mag;
  const lo = Math.floor(min / step + 1e-9) * step;
  const hi = Math.ceil(max / step - 1e-9) * step;
  const out: number[] = [];
  for (let v = lo; v <= hi + step * 1e-6; v += step) out.push(Math.abs(v) < step * 1e-9 ? 0 : v);
  return out;
}

function Label({
  x,
  y,
  text,
  anchor = "start",
  color = LABEL,
  size = 6.5,
  weight,
}: {
  x: number;
  y: number;
  text: string;
  anchor?: "start" | "middle" | "end";
  color?: string;
  size?: number;
  weight?: number;
}) {
  return (
    <SvgText
      x={x}
      y={y}
      fill={color}
      textAnchor={anchor}
      style={{ ...FONT, fontSize: size, ...(weight ? { fontWeight: weight } : {}) }}
    >
      {pdfText(text)}
    </SvgText>
  );
}

/** Horizontal gridlines with their value labels left of the plot; the zero line drawn as the axis. */
function HorizontalGrid({
  ticks,
  py,
  x1,
  x2,
  format,
}: {
  ticks: number[];
  py: (v: number) => number;
  x1: number;
  x2: number;
  format: (t: number) => string;
}) {
  return (
    <>
      {ticks.map((t, i) => (
        <G key={i}>
          <Line x1={x1} y1={py(t)} x2={x2} y2={py(t)} stroke={t === 0 ? AXIS : GRID} strokeWidth={0.5} />
          <Label x={x1 - 4} y={py(t) + 2.2} text={format(t)} anchor="end" />
        </G>
      ))}
    </>
  );
}

export interface LegendItem {
  label: string;
  color: string;
}

export function Legend({ items }: { items: LegendItem[] }) {
  return (
    <View style={{ flexDirection: "row", flexWrap: "wrap", marginTop: 3 }}>
      {items.map((it, i) => (
        <View
          key={i}
          style={{ flexDirection: "row", alignItems: "center", marginRight: 10, marginBottom: 2 }}
        >
          <View style={{ width: 7, height: 7, backgroundColor: it.color, marginRight: 3 }} />
          <T style={{ fontSize: 7, color: LABEL }}>{it.label}</T>
        </View>
      ))}
    </View>
  );
}

export function ChartFrame({
  title,
  subtitle,
  children,
}: {
  title: string;
  subtitle?: string;
  children: React.ReactNode;
}) {
  return (
    <View wrap={false} style={{ marginBottom: 10 }}>
      <T style={{ fontSize: 9, fontWeight: 600, color: COLORS.ink }}>{title}</T>
      {subtitle ? <T style={{ fontSize: 7.5, color: COLORS.inkFaint, marginBottom: 3 }}>{subtitle}</T> : null}
      {children}
    </View>
  );
}

// ---------------------------------------------------------------------------------------------------
// Cost stack: present value by category, one horizontal bar per option (credits drawn left of zero)
// ---------------------------------------------------------------------------------------------------

export interface StackSegment {
  key: string;
  value: number;
}

export function CostStackChart({
  bars,
  colors,
  currency,
  width = 500,
}: {
  bars: { label: string; segments: StackSegment[]; total: number }[];
  colors: Record<string, string>;
  currency: string;
  width?: number;
}) {
  // Labels sit above their bar so long option names never crowd the plot.
  const left = 22;
  const totalW = 44;
  const rowH = 30;
  const barH = 14;
  const top = 2;
  const height = top + bars.length * rowH + 14;
  const neg = Math.min(
    0,
    ...bars.map((b) => b.segments.filter((s) => s.value < 0).reduce((a, s) => a + s.value, 0)),
  );
  const pos = Math.max(
    0,
    ...bars.map((b) => b.segments.filter((s) => s.value > 0).reduce((a, s) => a + s.value, 0)),
  );
  const ticks = niceTicks(neg, pos, 6);
  const lo = ticks[0] ?? 0;
  const hi = ticks[ticks.length - 1] ?? 1;
  const plotW = width - left - totalW;
  const x = (v: number) => left + ((v - lo) / (hi - lo || 1)) * plotW;
  const axisY = top + bars.length * rowH;
  return (
    <Svg width={width} height={height} viewBox={`0 0 ${width} ${height}`}>
      {ticks.map((t, i) => (
        <G key={i}>
          <Line
            x1={x(t)}
            y1={top}
            x2={x(t)}
            y2={axisY}
            stroke={t === 0 ? AXIS : GRID}
            strokeWidth={t === 0 ? 0.8 : 0.5}
          />
          <Label x={x(t)} y={axisY + 9} text={fmtMoneyShort(t, currency)} anchor="middle" />
        </G>
      ))}
      {bars.map((b, i) => {
        const labelY = top + i * rowH + 9;
        const y = labelY + 3;
        let right = 0;
        let leftEdge = 0;
        return (
          <G key={i}>
            <Label x={x(0) + 1} y={labelY} text={b.label} color={COLORS.ink} size={7} weight={600} />
            {b.segments.map((s, j) => {
              if (s.value === 0) return null;
              let x0: number;
              let x1: number;
              if (s.value > 0) {
                x0 = x(right);
                right += s.value;
                x1 = x(right);
              } else {
                x1 = x(leftEdge);
                leftEdge += s.value;
                x0 = x(leftEdge);
              }
              return (
                <Rect
                  key={j}
                  x={x0}
                  y={y}
                  width={Math.max(0.3, x1 - x0)}
                  height={barH}
                  fill={colors[s.key] ?? COLORS.inkFaint}
                />
              );
            })}
            <Label
              x={width - 2}
              y={y + barH / 2 + 2.3}
              text={fmtMoneyShort(b.total, currency)}
              anchor="end"
              color={COLORS.ink}
              size={7.5}
              weight={600}
            />
          </G>
        );
      })}
    </Svg>
  );
}

// ---------------------------------------------------------------------------------------------------
// Lines over the study period (cumulative discounted cost)
// ---------------------------------------------------------------------------------------------------

export function LineChart({
  series,
  currency,
  width = 500,
  height = 180,
  xLabel = "Study year",
}: {
  series: { label: string; color: string; points: [number, number][] }[];
  currency: string;
  width?: number;
  height?: number;
  xLabel?: string;
}) {
  const left = 46;
  const right = 10;
  const top = 8;
  const bottom = 24;
  const xs = series.flatMap((s) => s.points.map((p) => p[0]));
  const ys = series.flatMap((s) => s.points.map((p) => p[1]));
  const xMax = Math.max(1, ...xs);
  const yTicks = niceTicks(Math.min(0, ...ys), Math.max(0, ...ys), 5);
  const y0 = yTicks[0] ?? 0;
  const y1 = yTicks[yTicks.length - 1] ?? 1;
  const px = (v: number) => left + (v / xMax) * (width - left - right);
  const py = (v: number) => top + (1 - (v - y0) / (y1 - y0 || 1)) * (height - top - bottom);
  const xTicks = niceTicks(0, xMax, 6).filter((t) => t <= xMax);
  return (
    <Svg width={width} height={height} viewBox={`0 0 ${width} ${height}`}>
      <HorizontalGrid ticks={yTicks} py={py} x1={left} x2={width - right} format={(t) => fmtMoneyShort(t, currency)} />
      {xTicks.map((t, i) => (
        <Label key={i} x={px(t)} y={height - bottom + 10} text={String(t)} anchor="middle" />
      ))}
      <Label x={(left + width - right) / 2} y={height - 3} text={xLabel} anchor="middle" />
      {series.map((s, i) => {
        const d = s.points
          .map((p, j) => `${j === 0 ? "M" : "L"}${px(p[0]).toFixed(2)},${py(p[1]).toFixed(2)}`)
          .join(" ");
        return <Path key={i} d={d} stroke={s.color} strokeWidth={1.4} fill="none" />;
      })}
    </Svg>
  );
}

// ---------------------------------------------------------------------------------------------------
// Grouped monthly bars (monthly water by option)
// ---------------------------------------------------------------------------------------------------

const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

export function MonthlyBarsChart({
  series,
  unit,
  width = 500,
  height = 160,
}: {
  series: { label: string; color: string; values: number[] }[];
  unit: string;
  width?: number;
  height?: number;
}) {
  const left = 46;
  const right = 6;
  const top = 8;
  const bottom = 16;
  const max = Math.max(0, ...series.flatMap((s) => s.values));
  const ticks = niceTicks(0, max, 4);
  const yMax = ticks[ticks.length - 1] ?? 1;
  const plotH = height - top - bottom;
  const groupW = (width - left - right) / 12;
  const barW = Math.min(9, (groupW * 0.78) / Math.max(1, series.length));
  const py = (v: number) => top + (1 - v / (yMax || 1)) * plotH;
  return (
    <Svg width={width} height={height} viewBox={`0 0 ${width} ${height}`}>
      <HorizontalGrid
        ticks={ticks}
        py={py}
        x1={left}
        x2={width - right}
        format={(t) => fmtNumber(t, t < 10 && t % 1 !== 0 ? 1 : 0)}
      />
      <Label x={4} y={top + 2} text={unit} />
      {MONTHS.map((m, i) => {
        const gx = left + i * groupW + (groupW - barW * series.length) / 2;
        return (
          <G key={i}>
            {series.map((s, j) => {
              const v = s.values[i] ?? 0;
              return (
                <Rect
                  key={j}
                  x={gx + j * barW}
                  y={py(v)}
                  width={barW - 0.8}
                  height={Math.max(0, py(0) - py(v))}
                  fill={s.color}
                />
              );
            })}
            <Label x={left + i * groupW + groupW / 2} y={height - 5} text={m} anchor="middle" />
          </G>
        );
      })}
    </Svg>
  );
}

// ---------------------------------------------------------------------------------------------------
// Tornado: net savings at each input's low and high value, around the base case
// ---------------------------------------------------------------------------------------------------

export function TornadoChart({
  bars,
  base,
  currency,
  width = 500,
}: {
  bars: { label: string; atLow: number; atHigh: number; lowText: string; highText: string }[];
  base: number;
  currency: string;
  width?: number;
}) {
  const labelW = 150;
  const right = 12;
  const rowH = 16;
  const top = 4;
  const height = top + bars.length * rowH + 20;
  const vals = bars.flatMap((b) => [b.atLow, b.atHigh]).concat([base, 0]);
  const ticks = niceTicks(Math.min(...vals), Math.max(...vals), 5);
  const lo = ticks[0] ?? 0;
  const hi = ticks[ticks.length - 1] ?? 1;
  const x = (v: number) => labelW + ((v - lo) / (hi - lo || 1)) * (width - labelW - right);
  const axisY = top + bars.length * rowH;
  return (
    <Svg width={width} height={height} viewBox={`0 0 ${width} ${height}`}>
      {ticks.map((t, i) => (
        <G key={i}>
          <Line
            x1={x(t)}
            y1={top}
            x2={x(t)}
            y2={axisY}
            stroke={t === 0 ? COLORS.ink : GRID}
            strokeWidth={t === 0 ? 0.8 : 0.5}
          />
          <Label x={x(t)} y={axisY + 9} text={fmtMoneyShort(t, currency)} anchor="middle" />
        </G>
      ))}
      <Line
        x1={x(base)}
        y1={top - 2}
        x2={x(base)}
        y2={axisY}
        stroke={COLORS.copper700}
        strokeWidth={0.8}
        strokeDasharray="2,1.5"
      />
      {bars.map((b, i) => {
        const y = top + i * rowH + 3;
        const h = rowH - 6;
        const segs: [number, string, string][] = [
          [b.atLow, COLORS.basin500, b.lowText],
          [b.atHigh, COLORS.copper400, b.highText],
        ];
        return (
          <G key={i}>
            <Label
              x={labelW - 6}
              y={y + h / 2 + 2.3}
              text={b.label}
              anchor="end"
              color={COLORS.ink}
              size={6.8}
            />
            {segs.map(([v, color, txt], j) => {
              const x0 = Math.min(x(v), x(base));
              const w = Math.abs(x(v) - x(base));
              const outside = v < base ? x0 - 2 : x0 + w + 2;
              return (
                <G key={j}>
                  <Rect x={x0} y={y} width={Math.max(0.4, w)} height={h} fill={color} />
                  <Label
                    x={outside}
                    y={y + h / 2 + 2.2}
                    text={txt}
                    anchor={v < base ? "end" : "start"}
                    size={5.8}
                  />
                </G>
              );
            })}
          </G>
        );
      })}
      <Label
        x={width - right}
        y={height - 2}
        text="net savings of the alternative over the base"
        anchor="end"
      />
    </Svg>
  );
}

// ---------------------------------------------------------------------------------------------------
// Histogram with P10 / P50 / P90 markers (Monte Carlo net savings)
// ---------------------------------------------------------------------------------------------------

export function HistogramChart({
  bins,
  markers,
  currency,
  width = 500,
  height = 150,
}: {
  bins: { from: number; to: number; count: number }[];
  markers: { label: string; value: number }[];
  currency: string;
  width?: number;
  height?: number;
}) {
  const left = 36;
  const right = 10;
  const top = 14;
  const bottom = 24;
  if (bins.length === 0) return null;
  const xMinRaw = Math.min(bins[0]?.from ?? 0, 0);
  const xMaxRaw = Math.max(bins[bins.length - 1]?.to ?? 1, 0);
  const xt = niceTicks(xMinRaw, xMaxRaw, 6);
  const x0 = xt[0] ?? 0;
  const x1 = xt[xt.length - 1] ?? 1;
  const maxCount = Math.max(1, ...bins.map((b) => b.count));
  const yt = niceTicks(0, maxCount, 4);
  const yMax = yt[yt.length - 1] ?? 1;
  const px = (v: number) => left + ((v - x0) / (x1 - x0 || 1)) * (width - left - right);
  const py = (v: number) => top + (1 - v / yMax) * (height - top - bottom);
  return (
    <Svg width={width} height={height} viewBox={`0 0 ${width} ${height}`}>
      {yt.map((t, i) => (
        <G key={i}>
          <Line x1={left} y1={py(t)} x2={width - right} y2={py(t)} stroke={GRID} strokeWidth={0.5} />
          <Label x={left - 4} y={py(t) + 2.2} text={fmtNumber(t)} anchor="end" />
        </G>
      ))}
      {bins.map((b, i) => (
        <Rect
          key={i}
          x={px(b.from)}
          y={py(b.count)}
          width={Math.max(0.3, px(b.to) - px(b.from) - 0.6)}
          height={py(0) - py(b.count)}
          fill={b.to <= 0 ? COLORS.copper400 : COLORS.basin500}
        />
      ))}
      <Line x1={px(0)} y1={top - 4} x2={px(0)} y2={py(0)} stroke={COLORS.ink} strokeWidth={0.8} />
      {markers.map((m, i) => (
        <G key={i}>
          <Line
            x1={px(m.value)}
            y1={top - 2}
            x2={px(m.value)}
            y2={py(0)}
            stroke={COLORS.basin900}
            strokeWidth={0.7}
            strokeDasharray="2,1.5"
          />
          <Label
            x={px(m.value)}
            y={top - 5 + (i % 2) * 0}
            text={m.label}
            anchor="middle"
            color={COLORS.basin900}
            size={6}
            weight={600}
          />
        </G>
      ))}
      {xt.map((t, i) => (
        <Label key={i} x={px(t)} y={height - bottom + 10} text={fmtMoneyShort(t, currency)} anchor="middle" />
      ))}
      <Label
        x={(left + width - right) / 2}
        y={height - 3}
        text="net savings of the alternative over the base (draws per bin on the left)"
        anchor="middle"
      />
    </Svg>
  );
}
