import { drawLine, drawParagraph, type Doc, type TextStyle } from './pdf-text';

/** The report's palette: neutral greys for structure, one accent, one warning colour. */
export const COLOR = {
  ink: '#1b1e23',
  muted: '#5a6270',
  faint: '#8a919c',
  rule: '#c6cbd3',
  hairline: '#e1e4e9',
  panel: '#f4f5f7',
  accent: '#1f5a85',
  accentLight: '#b9cada',
  warning: '#9a5200',
} as const;

/** A4 portrait in points, with 20 mm side margins. */
export const PAGE = { width: 595.28, height: 841.89, left: 56.7, right: 595.28 - 56.7, top: 52, bottom: 841.89 - 68 } as const;

export const STYLE = {
  body: { face: 'sans', size: 9, color: COLOR.ink },
  small: { face: 'sans', size: 7.5, color: COLOR.muted },
  label: { face: 'sans', size: 7.5, color: COLOR.muted },
  value: { face: 'sans', size: 9, color: COLOR.ink },
  mono: { face: 'mono', size: 8, color: COLOR.ink },
  heading: { face: 'bold', size: 10.5, color: COLOR.ink },
} satisfies Record<string, TextStyle>;

/** Where the next block goes; starts a new page when a block would not fit. */
export class Cursor {
  y: number = PAGE.top;
  readonly left = PAGE.left;
  readonly right = PAGE.right;
  readonly width = PAGE.right - PAGE.left;

  constructor(readonly doc: Doc) {}

  /** Makes room for a block of height h (a new page when it does not fit). */
  need(h: number): void {
    if (this.y + h > PAGE.bottom) this.newPage();
  }

  newPage(): void {
    this.doc.addPage();
    this.y = PAGE.top;
  }

  gap(h: number): void {
    this.y += h;
  }

  /** A numbered section heading with a hairline under it; keeps `keep` points of content with it. */
  heading(number: number, title: string, keep = 60): void {
    this.need(28 + keep);
    this.y += 6;
    drawLine(this.doc, `${number}`, this.left, this.y + 10.5, { ...STYLE.heading, color: COLOR.faint });
    drawLine(this.doc, title, this.left + 16, this.y + 10.5, STYLE.heading);
    this.y += 15;
    rule(this.doc, this.left, this.right, this.y, COLOR.rule, 0.6);
    this.y += 8;
  }

  paragraph(text: string, style: TextStyle = STYLE.body, opts: { markup?: boolean; indent?: number; width?: number } = {}): void {
    const x = this.left + (opts.indent ?? 0);
    const w = opts.width ?? this.width - (opts.indent ?? 0);
    const h = drawParagraph(this.doc, text, x, this.y, w, style, { markup: opts.markup, dryRun: true });
    this.need(h);
    drawParagraph(this.doc, text, x, this.y, w, style, { markup: opts.markup });
    this.y += h;
  }
}

export function rule(doc: Doc, x1: number, x2: number, y: number, color: string = COLOR.rule, width = 0.5, dash?: number): void {
  doc.save().lineWidth(width).strokeColor(color);
  if (dash) doc.dash(dash, { space: dash });
  doc.moveTo(x1, y).lineTo(x2, y).stroke();
  doc.restore();
}
