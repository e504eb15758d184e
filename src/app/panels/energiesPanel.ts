/**
 * The Energies panel: a cluster expansion fitted to total energies the user computed (an energies file; the DEMO
 * file at first), its predictions for the enumerated patterns of a range, the energy–η figure with both hulls and
 * the suggestions, the ECIs and the hull's chemical potentials. A click on a point or a suggestion shows that
 * pattern on the sheet, as the Candidates panel does. The fit runs in the expansion worker, with progress and stop;
 * a refused file or field is named and everything shown before is kept.
 */
import demoEnergies from '../../../presets/demo/hsl-energies.json' with { type: 'json' };
import { energyHullFigure, energyHullPick, setEnergyHullSelected } from '../../figures/energyHull.ts';
import type { FigureStyle } from '../../figures/types.ts';
import { hnfRows } from '../../lattice/pattern.ts';
import type { App } from '../app.ts';
import { readPairShells, readPredictHoles, readPredictSites, readTripletShells } from '../energiesFields.ts';
import type { ExpansionInput, ExpansionView, ShownPattern } from '../expansionJob.ts';
import { download, svgText, svgToPng } from '../download.ts';
import { Cancelled, WorkerLane } from '../worker/client.ts';
import { readField } from './readField.ts';

const $ = <T extends Element>(doc: Document, selector: string) => doc.querySelector<T>(selector)!;
const meV = (eV: number) => (Number.isFinite(eV) ? (1000 * eV).toFixed(2) : '—');
/** A number with a true minus sign; '—' when not finite. */
const signed = (x: number, digits: number) => (Number.isFinite(x) ? x.toFixed(digits).replace('-', '−') : '—');
const DEMO_FILE = { name: 'hsl-energies.json', text: JSON.stringify(demoEnergies) };

type Chosen = { kind: 'computed' | 'predicted'; index: number };

export class EnergiesPanel {
  /** The fit shown, and the file it was made from (kept when a new file or field is refused). */
  view: ExpansionView | undefined;
  private file = DEMO_FILE;
  private chosen: Chosen | null = null;
  /** A fit has been asked for (the first, or the user's): start() then has nothing to do. */
  private begun = false;
  private readonly lane: WorkerLane;

  constructor(private readonly app: App, private readonly doc: Document, createWorker: () => Worker) {
    this.lane = new WorkerLane(createWorker, 'expansion');
    $<HTMLFormElement>(doc, '#energies-form').addEventListener('submit', (event) => {
      event.preventDefault();
      void this.fit();
    });
    $<HTMLInputElement>(doc, '#energies-file').addEventListener('change', (event) => void this.openFile(event.target as HTMLInputElement));
    $<HTMLButtonElement>(doc, '#energies-demo').addEventListener('click', () => void this.fit(DEMO_FILE));
    $<HTMLButtonElement>(doc, '#energies-cancel').addEventListener('click', () => this.lane.cancel());
    $<HTMLElement>(doc, '#energy-hull-host').addEventListener('click', (event) => this.pick(event));
    $<HTMLButtonElement>(doc, '#energies-svg').addEventListener('click', () => void this.save('svg'));
    $<HTMLButtonElement>(doc, '#energies-png').addEventListener('click', () => void this.save('png'));
  }

  /** The first fit (the DEMO file): main.ts starts it when the panel comes near the viewport. */
  start(): void {
    if (!this.begun) void this.fit();
  }

  private field(name: string): HTMLInputElement {
    return $<HTMLFormElement>(this.doc, '#energies-form').elements.namedItem(name) as HTMLInputElement;
  }

  /** The form's values, or undefined with every bad field named and outlined (its text kept). */
  private readForm(): Omit<ExpansionInput, 'text' | 'name'> | undefined {
    const errors: string[] = [];
    const read = <T>(name: string, reader: (text: string) => T): T | undefined => readField(this.field(name), reader, errors);
    const pairShells = read('pairShells', readPairShells);
    const tripletShells = read('tripletShells', readTripletShells);
    const sites = read('sites', readPredictSites);
    const holes = read('holes', readPredictHoles);
    if (pairShells === undefined || tripletShells === undefined || sites === undefined || holes === undefined) {
      this.refuse(errors);
      return undefined;
    }
    return { pairShells, tripletShells, predict: { sites, holes, isolated: this.field('isolated').checked } };
  }

  private refuse(errors: string[]): void {
    $<HTMLElement>(this.doc, '#energies-error').textContent = errors.join('; ');
    const kept = this.view ? `the fit shown (${this.view.name}) is kept` : 'nothing is shown yet';
    for (const message of errors) this.app.notices.show(`${message} — ${kept}`);
  }

  private async openFile(input: HTMLInputElement): Promise<void> {
    const chosen = input.files?.[0];
    input.value = '';
    if (!chosen) return;
    await this.fit({ name: chosen.name, text: await chosen.text() });
  }

  /** Fits `file` (default: the file of the fit shown) with the form's settings; on success it becomes the file shown. */
  async fit(file = this.file): Promise<void> {
    this.begun = true;
    const settings = this.readForm();
    if (!settings) return;
    const progress = $<HTMLElement>(this.doc, '#energies-progress');
    progress.hidden = false;
    progress.querySelector('span')!.textContent = `fitting ${file.name}…`;
    try {
      const view = await this.lane.run<ExpansionView>('expand', { ...settings, ...file } satisfies ExpansionInput, (done, total, what) => {
        progress.querySelector('progress')!.value = total > 0 ? done / total : 0;
        progress.querySelector('span')!.textContent = `predicting: ${what}`;
      });
      this.file = file;
      this.view = view;
      this.chosen = null;
      $<HTMLElement>(this.doc, '#energies-error').textContent = '';
      this.draw();
    } catch (error) {
      if (!(error instanceof Cancelled)) this.refuse([error instanceof Error ? error.message : String(error)]);
    } finally {
      if (!this.lane.busy) progress.hidden = true;
    }
  }

  private draw(): void {
    const view = this.view;
    if (!view) return;
    $<HTMLElement>(this.doc, '#energies-source').textContent = `${view.demo ? 'DEMO — invented energies, not a calculation. ' : ''}${view.title && !view.demo ? `${view.title} — ` : ''}${view.name}: ${view.structures} structures.`;
    $<HTMLElement>(this.doc, '#energy-hull-host').replaceChildren(energyHullFigure(view.figure, { document: this.doc }));
    $<HTMLElement>(this.doc, '#energies-summary').textContent =
      `fit rms ${meV(view.fitRms)} meV/site, leave-one-out CV ${meV(view.cvRms)} meV/site; ${view.predicted.length} patterns predicted.${view.notes.map((note) => ` ${note[0].toUpperCase()}${note.slice(1)}.`).join('')}`;
    const clusters = view.clusters.map((c) => this.rowOf([c.name, String(c.perSite), `${signed(c.eci, 4)} ± ${signed(c.error, 4)}`]));
    $<HTMLTableSectionElement>(this.doc, '#energies-clusters tbody').replaceChildren(...clusters);
    const mu = (low: number, high: number) => `${Number.isFinite(low) ? signed(low, 3) : '−∞'} … ${Number.isFinite(high) ? signed(high, 3) : '+∞'}`;
    const hull = view.hull.map((h) => this.rowOf([h.eta.toFixed(4), h.label, mu(h.muLow, h.muHigh)]));
    $<HTMLTableSectionElement>(this.doc, '#energies-hull tbody').replaceChildren(...hull);
    const list = $<HTMLOListElement>(this.doc, '#energies-suggestions');
    list.replaceChildren(...view.suggestions.map((s) => {
      const item = this.doc.createElement('li');
      const button = this.doc.createElement('button');
      button.type = 'button';
      button.textContent = `η ${s.eta.toFixed(4)} ${s.label}`;
      button.addEventListener('click', () => this.show({ kind: 'predicted', index: s.index }));
      const why = this.doc.createElement('span');
      why.textContent = ` ${s.why}`;
      item.append(button, why);
      return item;
    }));
    if (view.suggestions.length === 0) list.replaceChildren(Object.assign(this.doc.createElement('li'), { textContent: 'nothing: no pattern of the range is a ground state of the fit or near its hull' }));
  }

  private rowOf(cells: string[]): HTMLTableRowElement {
    const row = this.doc.createElement('tr');
    for (const text of cells) row.insertCell().textContent = text;
    return row;
  }

  private pick(event: MouseEvent): void {
    const svg = $<HTMLElement>(this.doc, '#energy-hull-host').querySelector('svg');
    const matrix = svg?.getScreenCTM();
    if (!svg || !matrix) return;
    const point = new DOMPoint(event.clientX, event.clientY).matrixTransform(matrix.inverse());
    const hit = energyHullPick(svg, point.x, point.y);
    if (hit) this.show(hit);
  }

  /** Shows a point's pattern on the sheet (and rings it on the figure). */
  private show(chosen: Chosen): void {
    const view = this.view;
    if (!view) return;
    const shown: ShownPattern | undefined = (chosen.kind === 'computed' ? view.computed : view.predicted)[chosen.index];
    if (!shown) return;
    this.chosen = chosen;
    const svg = $<HTMLElement>(this.doc, '#energy-hull-host').querySelector('svg');
    if (svg) setEnergyHullSelected(svg, chosen);
    const { pattern } = shown;
    this.app.showPattern(shown.label, { bond: pattern.bond, supercell: hnfRows(pattern.supercell), vacancies: pattern.vacancies });
  }

  /** The energy–η figure as a file, in the publication look, named after the energies file. */
  private async save(kind: 'svg' | 'png'): Promise<void> {
    const svg = this.figure();
    if (!svg) return;
    const stem = `${this.file.name.replace(/\.[^.]*$/, '') || 'energies'}-hull`;
    if (kind === 'svg') download(this.doc, `${stem}.svg`, new Blob([svgText(svg)], { type: 'image/svg+xml' }));
    else download(this.doc, `${stem}.png`, await svgToPng(svg));
  }

  /** The figure in the publication look (for exports), with the chosen point ringed. */
  figure(style: FigureStyle = 'publication'): SVGSVGElement | undefined {
    if (!this.view) return undefined;
    const svg = energyHullFigure(this.view.figure, { document: this.doc, style });
    setEnergyHullSelected(svg, this.chosen);
    return svg;
  }
}
