/**
 * SVG → PNG for `lacuna plot --png`, with resvg (a general-purpose SVG renderer shipped as a native npm package).
 * Text needs fonts, and a machine may have none (`fc-list` empty in a bare container): resvg then draws no
 * text at all, silently. So the rasteriser never looks at system fonts; it loads Noto Sans (SIL Open Font
 * Licence, shipped by the @expo-google-fonts/noto-sans npm package; it has the Greek letters and Å the figures
 * use), and every PNG is the same on every machine.
 */
import { createRequire } from 'node:module';
import { invalid } from '../validate/invalid.ts';

const FONT_FILES = ['@expo-google-fonts/noto-sans/400Regular/NotoSans_400Regular.ttf', '@expo-google-fonts/noto-sans/400Regular_Italic/NotoSans_400Regular_Italic.ttf'];

/** PNG bytes of an SVG text at `scale` × its own size. */
export async function rasterise(svg: string, scale = 2): Promise<Uint8Array> {
  const require = createRequire(import.meta.url);
  let fontFiles: string[];
  try {
    fontFiles = FONT_FILES.map((file) => require.resolve(file));
  } catch {
    invalid('--png', 'Noto Sans', 'the font package @expo-google-fonts/noto-sans is not installed; run npm ci, or write --svg only');
  }
  let Resvg: typeof import('@resvg/resvg-js').Resvg;
  try {
    ({ Resvg } = await import('@resvg/resvg-js'));
  } catch (error) {
    invalid('--png', '@resvg/resvg-js', `the rasteriser cannot load on this platform (${(error as Error).message.split('\n')[0]}); write --svg only`);
  }
  const renderer = new Resvg(svg, {
    fitTo: { mode: 'zoom', value: scale },
    font: { loadSystemFonts: false, fontFiles, defaultFontFamily: 'Noto Sans', sansSerifFamily: 'Noto Sans' },
    background: 'rgba(255, 255, 255, 1)',
  });
  return renderer.render().asPng();
}
