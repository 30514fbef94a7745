/**
 * LoopLedger's report look: basin teal for the wet loops, copper for money, ink for text; IBM Plex Sans
 * throughout (its figures are tabular by default, all digits 600 units wide, so right-aligned columns line
 * up). Fonts come only from the repo's fonts/ folder, as the .woff files: fontkit (react-pdf's font
 * engine) cannot lay out a space in the Plex Mono .woff files and cannot subset composite glyphs (":",
 * ";", accented letters) from any of the .woff2 files, so neither is used here.
 */
import path from "node:path";
import { Font, StyleSheet } from "@react-pdf/renderer";

export const COLORS = {
  ink: "#17222b",
  inkSoft: "#3d4b57",
  inkFaint: "#6b7a86",
  paper: "#ffffff",
  paperSunk: "#f1f4f6",
  line: "#d3dce2",
  lineStrong: "#a9b7c1",
  basin50: "#eaf6f6",
  basin100: "#cdeaea",
  basin300: "#7cc4c6",
  basin500: "#1f8a8f",
  basin600: "#157277",
  basin700: "#0f5a5e",
  basin900: "#0a3436",
  copper100: "#f7e6da",
  copper400: "#d9854a",
  copper500: "#bf6a2e",
  copper700: "#86461b",
  caution50: "#fff7e6",
  caution600: "#a86a00",
  caution800: "#6b4300",
  danger600: "#b42323",
  ok600: "#1f7a45",
} as const;

/** One colour per option, in option order (teal, copper, slate, deep teal). */
export const OPTION_COLORS = [COLORS.basin600, COLORS.copper500, "#56697a", COLORS.basin300];

/** The faces the report uses, as file names in fonts/ (the worker thread registers the same list). */
export const FONT_FACES: { family: string; file: string; fontWeight: number; fontStyle?: "italic" }[] = [
  { family: "Plex Sans", file: "ibm-plex-sans-latin-400-normal.woff", fontWeight: 400 },
  { family: "Plex Sans", file: "ibm-plex-sans-latin-400-italic.woff", fontWeight: 400, fontStyle: "italic" },
  { family: "Plex Sans", file: "ibm-plex-sans-latin-500-normal.woff", fontWeight: 500 },
  { family: "Plex Sans", file: "ibm-plex-sans-latin-600-normal.woff", fontWeight: 600 },
  { family: "Plex Sans", file: "ibm-plex-sans-latin-700-normal.woff", fontWeight: 700 },
];

export function fontsDir(): string {
  return path.join(/*turbopackIgnore: true*/ process.cwd(), "fonts");
}

let registered = false;

/** Register the Plex faces once per process; never fetch a font. */
export function registerFonts(dir = fontsDir()): void {
  if (registered) return;
  Font.register({
    family: "Plex Sans",
    fonts: FONT_FACES.map((f) => ({
      src: path.join(/*turbopackIgnore: true*/ dir, f.file),
      fontWeight: f.fontWeight,
      ...(f.fontStyle ? { fontStyle: f.fontStyle } : {}),
    })),
  });
  // Words are never split with a hyphen: engineering terms and numbers must stay whole.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}

export const S = StyleSheet.create({
  page: {
    fontFamily: "Plex Sans",
    fontSize: 9,
    // No lineHeight here: react-pdf would turn it into points inherited by every text (and it drops the
    // page-number <Text render> that inherits one). The T component sets line heights.
    color: COLORS.ink,
    paddingTop: 62,
    paddingBottom: 52,
    paddingHorizontal: 48,
    backgroundColor: COLORS.paper,
  },
  header: {
    position: "absolute",
    top: 22,
    left: 48,
    right: 48,
    flexDirection: "row",
    justifyContent: "space-between",
    alignItems: "flex-end",
    borderBottomWidth: 0.75,
    borderBottomColor: COLORS.basin600,
    paddingBottom: 5,
    fontSize: 7.5,
    color: COLORS.inkSoft,
  },
  footerRule: {
    position: "absolute",
    bottom: 34,
    left: 48,
    right: 48,
    borderTopWidth: 0.5,
    borderTopColor: COLORS.line,
  },
  footerLeft: { position: "absolute", bottom: 22, left: 48, fontSize: 7, color: COLORS.inkFaint },
  footerRight: {
    position: "absolute",
    bottom: 22,
    left: 48,
    right: 48,
    fontSize: 7,
    color: COLORS.inkFaint,
    textAlign: "right",
  },
  h1: { fontSize: 17, fontWeight: 600, color: COLORS.basin900, lineHeight: 1.25, marginBottom: 8 },
  h2: { fontSize: 11.5, fontWeight: 600, color: COLORS.basin700, marginTop: 12, marginBottom: 5 },
  h3: { fontSize: 9.5, fontWeight: 600, color: COLORS.ink, marginTop: 8, marginBottom: 3 },
  kicker: {
    fontSize: 7.5,
    fontWeight: 600,
    color: COLORS.copper500,
    letterSpacing: 1.2,
    textTransform: "uppercase",
    marginBottom: 2,
  },
  p: { marginBottom: 5, fontSize: 9 },
  small: { fontSize: 7.5, color: COLORS.inkSoft },
  note: {
    backgroundColor: COLORS.basin50,
    borderLeftWidth: 2,
    borderLeftColor: COLORS.basin600,
    padding: 7,
    marginVertical: 6,
    fontSize: 8,
  },
  caution: {
    backgroundColor: COLORS.caution50,
    borderLeftWidth: 2,
    borderLeftColor: COLORS.caution600,
    padding: 7,
    marginBottom: 6,
    fontSize: 8.5,
  },
  table: { borderTopWidth: 0.75, borderTopColor: COLORS.ink, marginBottom: 8 },
  th: {
    flexDirection: "row",
    borderBottomWidth: 0.75,
    borderBottomColor: COLORS.ink,
    backgroundColor: COLORS.paperSunk,
    fontWeight: 600,
    fontSize: 7.5,
    color: COLORS.inkSoft,
  },
  tr: { flexDirection: "row", borderBottomWidth: 0.4, borderBottomColor: COLORS.line },
  trTotal: { flexDirection: "row", borderTopWidth: 0.75, borderTopColor: COLORS.ink, fontWeight: 600 },
  td: { paddingVertical: 2.5, paddingHorizontal: 3 },
  num: { textAlign: "right", fontSize: 7.8 },
});

/** react-pdf's style object (its types package is not a direct dependency). */
export type Style = import("@react-pdf/renderer").Styles[string];
