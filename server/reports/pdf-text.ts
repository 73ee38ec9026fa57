import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { inflateSync } from 'node:zlib';
import { dirname, join } from 'node:path';
import { THIN } from './typeset';

/*
 * The text layer of the report. Prose is set in Helvetica (built into every
 * PDF reader), figures, symbols and the model in the shipped JetBrains Mono.
 * Strings may carry the markup of `typeset.ts` (^{…} raised, _{…} lowered);
 * characters a face lacks are taken from the mono face, digit-group spaces
 * become narrow gaps and ∞ is drawn as a figure.
 */

export type Doc = PDFKit.PDFDocument;
type Face = 'sans' | 'bold' | 'mono' | 'mono-bold';

export interface TextStyle {
  face: Face;
  size: number;
  color?: string;
}

const MONO_FILES: Record<string, string> = {
  mono: 'jetbrains-mono-latin-400-normal.woff',
  'mono-bold': 'jetbrains-mono-latin-700-normal.woff',
  'mono-greek': 'jetbrains-mono-greek-400-normal.woff',
  'mono-bold-greek': 'jetbrains-mono-greek-700-normal.woff',
  'mono-ext': 'jetbrains-mono-latin-ext-400-normal.woff',
  'mono-bold-ext': 'jetbrains-mono-latin-ext-700-normal.woff',
};

/**
 * WOFF 1 → plain OpenType: the tables are zlib streams, inflated once here
 * with node's zlib, so each report does not inflate them again.
 */
function woffToSfnt(woff: Buffer): Buffer {
  if (woff.toString('latin1', 0, 4) !== 'wOFF') return woff;
  const numTables = woff.readUInt16BE(12);
  const tables: { tag: Buffer; checksum: number; data: Buffer }[] = [];
  for (let i = 0; i < numTables; i++) {
    const e = 44 + i * 20;
    const offset = woff.readUInt32BE(e + 4);
    const compLength = woff.readUInt32BE(e + 8);
    const origLength = woff.readUInt32BE(e + 12);
    const raw = woff.subarray(offset, offset + compLength);
    tables.push({ tag: woff.subarray(e, e + 4), checksum: woff.readUInt32BE(e + 16), data: compLength < origLength ? inflateSync(raw) : raw });
  }
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  const head = Buffer.alloc(12 + numTables * 16);
  woff.copy(head, 0, 4, 8);
  head.writeUInt16BE(numTables, 4);
  head.writeUInt16BE(searchRange, 6);
  head.writeUInt16BE(entrySelector, 8);
  head.writeUInt16BE(numTables * 16 - searchRange, 10);
  const parts: Buffer[] = [head];
  let offset = head.length;
  tables.forEach((t, i) => {
    const r = 12 + i * 16;
    t.tag.copy(head, r);
    head.writeUInt32BE(t.checksum, r + 4);
    head.writeUInt32BE(offset, r + 8);
    head.writeUInt32BE(t.data.length, r + 12);
    const padded = (t.data.length + 3) & ~3;
    parts.push(t.data, Buffer.alloc(padded - t.data.length));
    offset += padded;
  });
  return Buffer.concat(parts);
}

let fontData: Record<string, Buffer> | null = null;

function fonts(): Record<string, Buffer> {
  if (!fontData) {
    const dir = join(dirname(createRequire(import.meta.url).resolve('@fontsource/jetbrains-mono')), 'files');
    fontData = Object.fromEntries(Object.entries(MONO_FILES).map(([name, file]) => [name, woffToSfnt(readFileSync(join(dir, file)))]));
  }
  return fontData;
}

/** Figures and models are set letter by letter: no ligatures or contextual forms in the mono face. */
const PLAIN_FEATURES = { liga: false, calt: false, clig: false, dlig: false } as unknown as PDFKit.Mixins.OpenTypeFeatures[];

export function registerFonts(doc: Doc): void {
  for (const [name, data] of Object.entries(fonts())) doc.registerFont(name, data);
}

/** Characters Helvetica has in the encoding PDF readers give it (WinAnsi). */
const WIN_ANSI_EXTRA = new Set([...'€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ']);
const inWinAnsi = (c: string, cp: number) => (cp >= 0x20 && cp <= 0x7e) || (cp >= 0xa0 && cp <= 0xff) || WIN_ANSI_EXTRA.has(c);
const inGreek = (cp: number) => cp >= 0x370 && cp <= 0x3ff;
const inLatinExt = (cp: number) => (cp >= 0x100 && cp <= 0x24f) || (cp >= 0x1e00 && cp <= 0x1eff);

interface Piece {
  kind: 'text' | 'gap' | 'inf' | 'sqrt';
  text: string;
  font: string;
  size: number;
  rise: number;
  width: number;
}

function fontFor(face: Face, c: string): { font: string; scale: number } {
  const cp = c.codePointAt(0)!;
  const bold = face === 'bold' || face === 'mono-bold';
  const mono = bold ? 'mono-bold' : 'mono';
  if (face === 'sans' || face === 'bold') {
    if (inWinAnsi(c, cp)) return { font: bold ? 'Helvetica-Bold' : 'Helvetica', scale: 1 };
    // the mono face has a larger x-height than Helvetica
    if (inGreek(cp)) return { font: `${mono}-greek`, scale: 0.92 };
    if (inLatinExt(cp)) return { font: `${mono}-ext`, scale: 0.92 };
    return { font: mono, scale: 0.92 };
  }
  if (inGreek(cp)) return { font: `${mono}-greek`, scale: 1 };
  if (inLatinExt(cp)) return { font: `${mono}-ext`, scale: 1 };
  return { font: mono, scale: 1 };
}

/** Widths depend only on font, size and text; shared by all reports. */
const widthCache = new Map<string, number>();

/** Splits markup into pieces of one font, size and rise each, measured. */
function pieces(doc: Doc, text: string, style: TextStyle, markup: boolean): Piece[] {
  const out: Piece[] = [];
  let level: 0 | 1 | -1 = 0;
  const push = (kind: Piece['kind'], ch: string, font: string, size: number, rise: number) => {
    const last = out[out.length - 1];
    if (kind === 'text' && last && last.kind === 'text' && last.font === font && last.size === size && last.rise === rise) last.text += ch;
    else out.push({ kind, text: ch, font, size, rise, width: 0 });
  };
  const chars = [...text];
  for (let i = 0; i < chars.length; i++) {
    const c = chars[i];
    if (markup && (c === '^' || c === '_') && chars[i + 1] === '{') {
      level = c === '^' ? 1 : -1;
      i++;
      continue;
    }
    if (markup && c === '}' && level !== 0) {
      level = 0;
      continue;
    }
    const base = level === 0 ? style.size : style.size * 0.68;
    const rise = level === 1 ? style.size * 0.36 : level === -1 ? -style.size * 0.16 : 0;
    if (c === THIN || c === '\u2009') push('gap', c, 'Helvetica', base, rise);
    else if (c === '∞') push('inf', c, 'Helvetica', base, rise);
    else if (c === '√') push('sqrt', c, 'Helvetica', base, rise);
    else if (c === '\n' || c === '\t') push('text', ' ', fontFor(style.face, ' ').font, base, rise);
    else {
      const f = fontFor(style.face, c);
      push('text', c, f.font, base * f.scale, rise);
    }
  }
  for (const p of out) {
    if (p.kind === 'gap') p.width = p.size * 0.2 * [...p.text].length;
    else if (p.kind === 'inf') p.width = p.size * 0.78;
    else if (p.kind === 'sqrt') p.width = p.size * 0.62;
    else {
      const key = `${p.font}|${p.size}|${p.text}`;
      let w = widthCache.get(key);
      if (w === undefined) {
        w = doc
          .font(p.font)
          .fontSize(p.size)
          .widthOfString(p.text, p.font.startsWith('mono') ? { features: PLAIN_FEATURES } : undefined);
        if (widthCache.size > 20_000) widthCache.clear();
        widthCache.set(key, w);
      }
      p.width = w;
    }
  }
  return out;
}

export function textWidth(doc: Doc, text: string, style: TextStyle, markup = true): number {
  return pieces(doc, text, style, markup).reduce((s, p) => s + p.width, 0);
}

function drawInfinity(doc: Doc, x: number, baseline: number, size: number, color: string): void {
  const w = size * 0.74;
  const h = size * 0.3;
  const cy = baseline - size * 0.3;
  const l = x + size * 0.02;
  doc.save();
  doc.lineWidth(size * 0.075).strokeColor(color);
  doc
    .moveTo(l + w / 2, cy)
    .bezierCurveTo(l + w * 0.72, cy - h, l + w, cy - h, l + w, cy)
    .bezierCurveTo(l + w, cy + h, l + w * 0.72, cy + h, l + w / 2, cy)
    .bezierCurveTo(l + w * 0.28, cy - h, l, cy - h, l, cy)
    .bezierCurveTo(l, cy + h, l + w * 0.28, cy + h, l + w / 2, cy)
    .stroke();
  doc.restore();
}

/** The radical sign, drawn: neither Helvetica's encoding nor the shipped mono subsets have it. */
function drawRadical(doc: Doc, x: number, baseline: number, size: number, color: string): void {
  doc.save();
  doc
    .lineWidth(size * 0.07)
    .strokeColor(color)
    .lineJoin('round');
  doc
    .moveTo(x + size * 0.04, baseline - size * 0.34)
    .lineTo(x + size * 0.16, baseline - size * 0.4)
    .lineTo(x + size * 0.3, baseline + size * 0.02)
    .lineTo(x + size * 0.52, baseline - size * 0.78)
    .lineTo(x + size * 0.62, baseline - size * 0.78)
    .stroke();
  doc.restore();
}

function drawPieces(doc: Doc, ps: Piece[], x: number, baseline: number, color: string): number {
  let cx = x;
  for (const p of ps) {
    if (p.kind === 'text') {
      doc
        .font(p.font)
        .fontSize(p.size)
        .fillColor(color)
        .text(p.text, cx, baseline - p.rise, { lineBreak: false, baseline: 'alphabetic', ...(p.font.startsWith('mono') ? { features: PLAIN_FEATURES } : {}) });
    } else if (p.kind === 'inf') {
      drawInfinity(doc, cx, baseline - p.rise, p.size, color);
    } else if (p.kind === 'sqrt') {
      drawRadical(doc, cx, baseline - p.rise, p.size, color);
    }
    cx += p.width;
  }
  return cx - x;
}

export interface LineOptions {
  /** 'left' draws from x; 'right' ends at x; 'center' centres on x. */
  align?: 'left' | 'right' | 'center';
  markup?: boolean;
}

/** One line of text on a baseline; returns its width. */
export function drawLine(doc: Doc, text: string, x: number, baseline: number, style: TextStyle, opts: LineOptions = {}): number {
  const ps = pieces(doc, text, style, opts.markup ?? true);
  const w = ps.reduce((s, p) => s + p.width, 0);
  const left = opts.align === 'right' ? x - w : opts.align === 'center' ? x - w / 2 : x;
  drawPieces(doc, ps, left, baseline, style.color ?? '#000');
  return w;
}

export interface ParagraphOptions {
  markup?: boolean;
  /** Line height as a multiple of the size. */
  leading?: number;
  /** Measure only, draw nothing. */
  dryRun?: boolean;
}

/**
 * A wrapped paragraph whose first baseline sits one size below `top`;
 * returns the height used (top to below the last line).
 */
export function drawParagraph(doc: Doc, text: string, x: number, top: number, width: number, style: TextStyle, opts: ParagraphOptions = {}): number {
  const markup = opts.markup ?? true;
  const lead = style.size * (opts.leading ?? 1.4);
  const lines: string[] = [];
  for (const para of text.split('\n')) {
    const words = para.split(/ +/);
    let line = '';
    for (const word of words) {
      const next = line ? `${line} ${word}` : word;
      if (line && textWidth(doc, next, style, markup) > width) {
        lines.push(line);
        line = word;
      } else line = next;
    }
    lines.push(line);
  }
  if (!opts.dryRun) {
    lines.forEach((l, i) => drawLine(doc, l, x, top + style.size + i * lead, style, { markup }));
  }
  return style.size * 0.35 + lines.length * lead;
}
