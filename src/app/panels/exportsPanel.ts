/**
 * Save and share: figures as SVG and PNG in the publication style (drawn anew by the figure code, no UI
 * chrome), bands and DOS as CSV, the sheet as JSON, CIF or extended XYZ (the core's writers), the link of the
 * view, keeping a sheet in the browser's library, and importing sheets and libraries back — with the field
 * errors shown and the current sheet kept when an import is refused.
 */
import { bandsFigure } from '../../figures/bands.ts';
import { dosFigure } from '../../figures/dos.ts';
import { etaDeltaFigure } from '../../figures/etaDelta.ts';
import { setRule } from '../../figures/energyPlot.ts';
import { sheetFigure } from '../../figures/sheet.ts';
import { zoneFigure } from '../../figures/zone.ts';
import { parseCifText } from '../../io/cifRead.ts';
import { sheetToCif } from '../../io/cif.ts';
import { bandsCsv, dosCsv } from '../../io/csv.ts';
import { ValidationError } from '../../validate/invalid.ts';
import { patternToJson, sheetToJson } from '../../io/sheetJson.ts';
import { parseSheetText } from '../../io/sheetFile.ts';
import { sheetToXyz } from '../../io/xyz.ts';
import type { App } from '../app.ts';
import { download, svgText, svgToPng } from '../download.ts';
import { libraryToJson, mergeLibraries, parseLibrary } from '../library.ts';
import type { MetalPanel } from './metalPanel.ts';
import type { StmPanel } from './stmPanel.ts';
import { SpectrumView } from './spectrumView.ts';

const $ = <T extends Element>(doc: Document, selector: string) => doc.querySelector<T>(selector)!;

/** A file-name stem from the sheet's label. */
function stem(label: string): string {
  return label.replace(/[^A-Za-z0-9_.-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'sheet';
}

/** The figure in the publication style, from the data on screen. */
export function publicationFigure(app: App, doc: Document, figure: string, metal?: MetalPanel, stm?: StmPanel): SVGSVGElement | undefined {
  const spectra = app.spectra;
  const options = { document: doc, style: 'publication' as const };
  if (figure === 'sheet') return sheetFigure(app.sheetData(), options);
  if (figure === 'eta-delta') return metal?.etaDelta.map ? etaDeltaFigure(metal.etaDelta.map, options) : undefined;
  if (figure === 'stm' || figure === 'stm-measured') return stm?.figure(figure);
  if (!spectra) return undefined;
  const energyRange = SpectrumView.energyRange(spectra, app.energyWindow.low, app.energyWindow.high);
  const rule = app.ruleEnergy() ?? null;
  if (figure === 'bands') {
    const svg = bandsFigure(spectra, { ...options, energyRange, selected: app.selected ? app.state.pick : undefined });
    setRule(svg, rule);
    return svg;
  }
  if (figure === 'dos') {
    const svg = dosFigure(spectra, { ...options, energyRange });
    setRule(svg, rule);
    return svg;
  }
  return zoneFigure(spectra, options);
}

/** What to say when a figure is not there yet. */
const NOT_READY: Record<string, string> = {
  'eta-delta': 'the η–δ map is still being computed; try again in a moment',
  stm: 'the STM model picture is still being computed; try again in a moment',
  'stm-measured': 'no measured picture yet: open one in the STM panel (or press “DEMO picture”)',
};

export function wireExports(app: App, doc: Document, metal?: MetalPanel, stm?: StmPanel): void {
  const figureSelect = $<HTMLSelectElement>(doc, '#export-figure');
  const save = async (kind: string) => {
    const label = stem(app.resolved.label);
    const spectra = app.spectra;
    if (kind === 'svg' || kind === 'png') {
      const svg = publicationFigure(app, doc, figureSelect.value, metal, stm);
      if (!svg) return app.notices.show(NOT_READY[figureSelect.value] ?? 'the bands are still being computed; try again in a moment', 'info');
      const name = `${label}-${figureSelect.value}`;
      if (kind === 'svg') download(doc, `${name}.svg`, new Blob([svgText(svg)], { type: 'image/svg+xml' }));
      else download(doc, `${name}.png`, await svgToPng(svg));
      return;
    }
    if (kind === 'bands-csv' || kind === 'dos-csv') {
      if (!spectra) return app.notices.show('the bands are still being computed; try again in a moment', 'info');
      const text = kind === 'bands-csv' ? bandsCsv(spectra.path) : dosCsv(spectra.dos);
      download(doc, `${label}-${kind === 'bands-csv' ? 'bands' : 'dos'}.csv`, new Blob([text], { type: 'text/csv' }));
      return;
    }
    const r = app.resolved;
    const named = { ...r.sheet, name: r.label };
    if (kind === 'sheet-json') {
      const text = r.pattern ? patternToJson({ ...r.pattern, name: r.label }) : sheetToJson(named);
      download(doc, `${label}.json`, new Blob([text], { type: 'application/json' }));
    } else if (kind === 'sheet-cif') {
      download(doc, `${label}.cif`, new Blob([sheetToCif(named)], { type: 'chemical/x-cif' }));
    } else if (kind === 'sheet-xyz') {
      download(doc, `${label}.xyz`, new Blob([sheetToXyz(named)], { type: 'chemical/x-xyz' }));
    } else if (kind === 'library') {
      download(doc, 'lacuna-library.json', new Blob([libraryToJson(app.library)], { type: 'application/json' }));
    }
  };
  for (const button of doc.querySelectorAll<HTMLButtonElement>('[data-export]')) {
    button.addEventListener('click', () => {
      save(button.dataset.export!).catch((error: unknown) => app.notices.show(error instanceof Error ? error.message : String(error)));
    });
  }

  $<HTMLInputElement>(doc, '#import-sheet').addEventListener('change', async (event) => {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    const text = await file.text();
    try {
      const parsed = /\.cif$/i.test(file.name) || /^\s*(#|data_)/.test(text) ? parseCifText(text, file.name) : parseSheetText(text, file.name);
      const label = parsed.sheet.name ?? file.name.replace(/\.[^.]+$/, '');
      const sheet = parsed.pattern
        ? { kind: 'pattern' as const, label, pattern: parsed.pattern }
        : { kind: 'explicit' as const, label, sheet: parsed.sheet };
      await app.edit({ sheet, pick: undefined }, 'spectra');
    } catch (error) {
      if (!(error instanceof ValidationError)) throw error;
      app.notices.show(`${file.name}: ${error.message} — the current sheet is kept`);
    }
  });

  $<HTMLInputElement>(doc, '#import-library').addEventListener('change', async (event) => {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    try {
      const incoming = parseLibrary(await file.text(), file.name);
      app.library = mergeLibraries(app.library, incoming);
      app.saveLibrary();
      app.notices.show(`${file.name}: ${incoming.sheets.length} sheets and ${incoming.parameterSets.length} parameter sets added to your library`, 'info');
      app.onChange.forEach((listener) => listener());
    } catch (error) {
      if (!(error instanceof ValidationError)) throw error;
      app.notices.show(`${file.name}: ${error.message} — nothing was imported; your library is unchanged`);
    }
  });

  $<HTMLButtonElement>(doc, '#save-sheet').addEventListener('click', () => {
    const r = app.resolved;
    const label = r.label;
    const entry = r.pattern ? { label, pattern: r.pattern } : { label, sheet: r.sheet };
    app.library = { ...app.library, sheets: app.library.sheets.filter((s) => s.label !== label).concat(entry) };
    app.saveLibrary();
    app.notices.show(`kept "${label}" in this browser's library (export it to move it to another browser)`, 'info');
    app.onChange.forEach((listener) => listener());
  });

  $<HTMLButtonElement>(doc, '#copy-link').addEventListener('click', async () => {
    try {
      await navigator.clipboard.writeText(location.href);
      app.notices.show('link to this view copied', 'info');
    } catch {
      app.notices.show(`copy this link: ${location.href}`, 'info');
    }
  });
}
