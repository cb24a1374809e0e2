// The few parts of fontkit (installed with pdfkit, which uses it to embed fonts) that fonts.ts needs.
declare module 'fontkit' {
  export interface Glyph {
    id: number;
    advanceWidth: number;
  }
  export interface GlyphPosition {
    xAdvance: number;
    yAdvance: number;
    xOffset: number;
    yOffset: number;
  }
  export interface GlyphRun {
    glyphs: Glyph[];
    positions: GlyphPosition[];
    readonly advanceWidth: number;
  }
  export interface Font {
    glyphsForString(text: string): Glyph[];
    layout(text: string, features?: unknown): GlyphRun;
  }
  export function create(buffer: Uint8Array): Font;
}
