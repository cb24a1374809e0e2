// The bundled fonts (DejaVu Sans, licence beside the files in assets/fonts), read once per process.
// Layout is left unshaped: full OpenType shaping costs about 0.1 ms for every distinct word, and a
// package of a few hundred pages is mostly distinct numbers; technical text needs no ligatures, and
// the combining marks we print (λ̄) have no advance width in this font, so they sit over their letter.
import { readFileSync } from 'node:fs';
import { create, type Font, type GlyphRun } from 'fontkit';
import { FONT_FILES } from './layout.ts';

function unshaped(font: Font): Font {
  font.layout = (text: string): GlyphRun => {
    const glyphs = font.glyphsForString(text);
    const positions = glyphs.map((g) => ({ xAdvance: g.advanceWidth, yAdvance: 0, xOffset: 0, yOffset: 0 }));
    let width: number | null = null;
    return {
      glyphs,
      positions,
      // pdfkit scales the positions in place before it first reads the width, so sum them then.
      get advanceWidth() {
        width ??= positions.reduce((w, p) => w + p.xAdvance, 0);
        return width;
      },
    };
  };
  return font;
}

let loaded: Record<string, Font> | null = null;

export function bundledFonts(): Record<string, Font> {
  loaded ??= Object.fromEntries(
    Object.entries(FONT_FILES).map(([name, file]) => [name, unshaped(create(readFileSync(file)))]),
  );
  return loaded;
}
