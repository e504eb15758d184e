import { describe, expect, it } from 'vitest';
import { runCli } from '../../src/cli/run.ts';
import { PNG_SCALE } from '../../src/cli/commands/plot.ts';
import { bandsFigure } from '../../src/figures/bands.ts';
import { headlessDocument } from '../../src/figures/headless.ts';
import { prepareSheet, prepareSpectra } from '../../src/figures/prepare.ts';
import { svgText } from '../../src/figures/serialize.ts';
import { sheetFigure } from '../../src/figures/sheet.ts';
import { findSheetPreset } from '../../src/lattice/presets.ts';
import { findParameterPreset } from '../../src/tb/params.ts';
import { fakeIo } from './fakeIo.ts';

async function cli(argv: string[], files: Record<string, string> = {}) {
  const io = fakeIo(files);
  const code = await runCli(argv, io);
  return { code, stdout: io.stdout(), stderr: io.stderr(), files: io.files };
}

const PARAMS = findParameterPreset('harrison1980')!;

/** The figure code's own output, with ids as the CLI's first figure in a fresh module would have them. */
function sameIds(text: string): string {
  return text.replace(/lacuna-(\w+)-\d+-/g, 'lacuna-$1-N-');
}

describe('lacuna plot', () => {
  it('writes the bands SVG the figure code draws for the same inputs, and prints the contract JSON', async () => {
    const { code, stdout, files } = await cli(['plot', 'honeycomb', '--figure', 'bands', '--mesh', '8', '--points', '40', '--svg', 'b.svg', '--json']);
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    const sheet = prepareSheet({ label: 'honeycomb', pattern: findSheetPreset('honeycomb')!.pattern }, { bondCutoff: PARAMS.cutoff });
    const spectra = prepareSpectra(sheet.sheet, PARAMS, { label: 'honeycomb', mesh: 8, pathPoints: 40 });
    expect(document).toEqual({ svg: 'b.svg', png: null, figure: 'bands', fermi: spectra.fermi, sheet: 'honeycomb', parameters: 'harrison1980' });
    const written = String(files.get('b.svg'));
    const expected = svgText(bandsFigure(spectra, { document: headlessDocument(), style: 'publication' }));
    expect(sameIds(written)).toBe(sameIds(expected));
    // It parses as SVG with the contract's attributes.
    const svg = new DOMParserLike(written);
    expect(svg.root.getAttribute('data-figure')).toBe('bands');
    expect(svg.root.querySelector('line[data-fermi]')!.getAttribute('data-fermi')).toBe(String(spectra.fermi));
  });

  it('E_F of plot equals lacuna fill for the same flags (the page’s contract)', async () => {
    const fill = JSON.parse((await cli(['fill', 'alpha', '--mesh', '10', '--doping', '0.1', '--json'])).stdout);
    const plot = JSON.parse((await cli(['plot', 'alpha', '--figure', 'zone', '--mesh', '10', '--doping', '0.1', '--svg', 'z.svg', '--json'])).stdout);
    expect(plot.fermi).toBe(fill.fermi);
  });

  it('writes a PNG with the PNG signature at PNG_SCALE × the figure size', async () => {
    const { code, files } = await cli(['plot', 'alpha', '--figure', 'sheet', '--repeats', '2', '--png', 's.png', '--svg', 's.svg']);
    expect(code).toBe(0);
    const png = files.get('s.png') as Uint8Array;
    // PNG signature and IHDR width/height, big-endian at bytes 16–23 (PNG specification, ISO/IEC 15948).
    expect([...png.subarray(0, 8)]).toEqual([137, 80, 78, 71, 13, 10, 26, 10]);
    const view = new DataView(png.buffer, png.byteOffset, png.byteLength);
    expect(view.getUint32(16)).toBe(560 * PNG_SCALE);
    expect(view.getUint32(20)).toBe(560 * PNG_SCALE);
    const sheet = prepareSheet({ label: 'alpha', pattern: findSheetPreset('alpha')!.pattern }, { bondCutoff: PARAMS.cutoff, repeats: [2, 2] });
    expect(sameIds(String(files.get('s.svg')))).toBe(sameIds(svgText(sheetFigure(sheet, { document: headlessDocument(), style: 'publication' }))));
  });

  it('draws the η–δ map of the named sheets with the sheet marked (eta-delta), taking the alignment flags', async () => {
    const { code, stdout, files } = await cli(['plot', 'chi3', '--figure', 'eta-delta', '--mesh', '8', '--dipole', '0.5', '--svg', 'm.svg', '--json']);
    expect(code).toBe(0);
    expect(JSON.parse(stdout)).toMatchObject({ svg: 'm.svg', figure: 'eta-delta', fermi: null, sheet: 'chi3' });
    const svg = new DOMParserLike(String(files.get('m.svg'))).root;
    expect(svg.getAttribute('data-figure')).toBe('eta-delta');
    // χ3 has η = 1/5 (Feng et al., Nat. Chem. 8, 563 (2016)).
    expect(Number(svg.querySelector('[data-layer="current"]')!.getAttribute('data-eta'))).toBeCloseTo(0.2, 12);
    expect(svg.querySelector('desc')!.textContent).toContain('Δc = 0.5 eV');
    expect(svg.querySelectorAll('path[data-metal]').length).toBe(5 * 4);
  });

  it('draws the simulated STM picture (stm) with the tip flags, the same picture the web view draws, and names the model', async () => {
    const { code, stdout, files } = await cli(['plot', 'beta12', '--figure', 'stm', '--bias', '-0.5', '--mesh', '8', '--svg', 'p.svg']);
    expect(code).toBe(0);
    expect(stdout).toMatch(/not predictions/);
    const svg = new DOMParserLike(String(files.get('p.svg'))).root;
    expect(svg.getAttribute('data-figure')).toBe('stm');
    expect(svg.getAttribute('data-pixels')).toBe('256 256');
    expect(svg.querySelector('desc')!.textContent).toMatch(/V = −0\.5 V \(filled states\).*Tersoff–Hamann/);
    expect(svg.querySelector('image')!.getAttribute('href')).toMatch(/^data:image\/png;base64,iVBORw0KGgo/);
  });

  it('never replaces a file without --overwrite, and refuses missing or misplaced flags in the error form', async () => {
    const refused = async (argv: string[], pattern: RegExp, files: Record<string, string> = {}) => {
      const result = await cli(argv, files);
      expect(result.code).toBe(2);
      expect(result.stdout).toBe('');
      expect(result.stderr).toMatch(/^invalid [^\n]+\n$/);
      expect(result.stderr).toMatch(pattern);
    };
    await refused(['plot', 'alpha', '--figure', 'dos', '--svg', 'x.svg'], /^invalid --svg: "x.svg" \(the file exists; add --overwrite/, { 'x.svg': 'old' });
    await refused(['plot', 'alpha', '--svg', 'x.svg'], /^invalid --figure: missing \(required/);
    await refused(['plot', 'alpha', '--figure', 'dos'], /^invalid --svg: missing \(give --svg FILE, --png FILE or both\)/);
    await refused(['plot', 'alpha', '--figure', 'graph', '--svg', 'x.svg'], /^invalid --figure: "graph"/);
    await refused(['plot', 'alpha', '--figure', 'sheet', '--mesh', '4', '--svg', 'x.svg'], /^invalid --mesh: 4 \(not used by the sheet figure\)/);
    await refused(['plot', 'alpha', '--figure', 'bands', '--repeats', '2', '--svg', 'x.svg'], /^invalid --repeats: 2 \(only for --figure sheet\)/);
    await refused(['plot', 'alpha', '--figure', 'dos', '--dipole', '0.2', '--svg', 'x.svg'], /^invalid --dipole: 0.2 \(only for --figure eta-delta\)/);
    await refused(['plot', 'alpha', '--figure', 'bands', '--bias', '1', '--svg', 'x.svg'], /^invalid --bias: 1 \(only for --figure stm\)/);
    await refused(['plot', 'alpha', '--figure', 'stm', '--bias', '0', '--svg', 'x.svg'], /^invalid --bias: 0 \(\|V\| must be at least 0\.01 V/);
    await refused(['plot', 'alpha', '--figure', 'eta-delta', '--doping', '0.2', '--svg', 'x.svg'], /^invalid --doping: 0.2 \(not used by the eta-delta figure\)/);
    await refused(['plot', 'alpha', '--figure', 'eta-delta', '--distance', '2', '--svg', 'x.svg'], /^invalid --distance: 2 \(the distance d = 2 Å must be at least d0/);
    const replaced = await cli(['plot', 'alpha', '--figure', 'sheet', '--svg', 'x.svg', '--overwrite'], { 'x.svg': 'old' });
    expect(replaced.code).toBe(0);
    expect(String(replaced.files.get('x.svg'))).toMatch(/^<\?xml/);
  });
});

/** Parses SVG text with the headless document's parser (linkedom's XML mode). */
class DOMParserLike {
  readonly root: Element;
  constructor(text: string) {
    const { DOMParser } = (headlessDocument().defaultView ?? {}) as { DOMParser?: new () => DOMParser };
    if (!DOMParser) throw new Error('no DOMParser');
    const parsed = new DOMParser().parseFromString(text.replace(/^<\?xml[^>]*>\n/, ''), 'image/svg+xml');
    this.root = parsed.documentElement;
  }
}
