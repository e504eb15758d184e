/**
 * The Unfolded bands panel: the sheet's bands unfolded onto the triangular lattice along Γ–M–K–Γ of its zone, and
 * a constant-energy cut over that zone at E_F + ΔE (ΔE the user's, default 0), both as density pictures; which
 * orbitals they show; their SVG/PNG files. The diagonalisation runs once per sheet and parameter set in the
 * unfolding worker, which keeps it; a new Gaussian width, E_F (the doping slider), energy window, cut energy or
 * part only redraws from what it kept. Draws wait for each other (latest wins): a running one is never cancelled,
 * since cancelling ends the worker and what it kept.
 */
import { cutFigure } from '../../figures/cut.ts';
import { readLinear } from '../../figures/frame.ts';
import type { FigureStyle } from '../../figures/types.ts';
import { unfoldedFigure } from '../../figures/unfolded.ts';
import { formatFraction } from '../../figures/format.ts';
import { isPlanar } from '../../lattice/sheet.ts';
import { patternUnfolding, sheetUnfolding, NOT_TRIANGULAR, type UnfoldingSheet } from '../../tb/unfoldSheet.ts';
import { ValidationError } from '../../validate/invalid.ts';
import type { App } from '../app.ts';
import { download, svgText, svgToPng } from '../download.ts';
import { parameterSet } from '../state.ts';
import { readCutEnergy, readPart } from '../unfoldState.ts';
import { Cancelled, JobError, WorkerLane } from '../worker/client.ts';
import { NO_UNFOLDING, type DrawInput, type DrawOutput, type SolveInput } from '../worker/unfoldWorker.ts';
import { nextTask, pathPlace, SpectrumView } from './spectrumView.ts';

const $ = <T extends Element>(doc: Document, selector: string) => doc.querySelector<T>(selector)!;

/** Points on the path, pixels per side of the cut, rows of the picture. */
const PATH_POINTS = 300;
const CUT_PIXELS = 61;
const ROWS = 300;
/** Seconds per (matrix order)³ with eigenvectors (bench/eigh.ts, rounded up, as src/cli/workEstimate.ts). */
const VECTORS_PER_CUBE = 5e-9;
/** Longest solve started without asking (s). */
const AUTO_SECONDS = 8;

export class UnfoldPanel {
  readonly lane: WorkerLane;
  /** Time (ms) of the last drawing of the two figures on the page's thread (the browser test prints it). */
  renderMs = 0;
  /** What the kept solution was solved for: the sheet's label and structure and the parameter set, as text. */
  private solvedFor = '';
  private solveGeneration = 0;
  private solving = false;
  private drawing = false;
  private drawWanted = false;
  private scheduled = false;
  private unfolding: UnfoldingSheet | undefined;
  /** The data drawn now (the exports redraw it in the publication look). */
  drawn: DrawOutput | undefined;
  unfoldedSvg: SVGSVGElement | undefined;
  cutSvg: SVGSVGElement | undefined;

  constructor(private readonly app: App, private readonly doc: Document, createWorker: () => Worker) {
    this.lane = new WorkerLane(createWorker, 'unfolding');
    const cut = $<HTMLInputElement>(doc, '#cut-energy');
    cut.addEventListener('change', () => {
      try {
        const value = readCutEnergy(cut.value, 'cut energy E − E_F');
        cut.classList.remove('invalid');
        void app.edit({ unfold: { ...app.state.unfold, cut: value } }, 'none');
      } catch (error) {
        if (!(error instanceof ValidationError)) throw error;
        cut.classList.add('invalid');
        app.notices.show(`${error.message} — the cut stays at E_F ${this.signed(app.state.unfold.cut)} eV`);
      }
    });
    const part = $<HTMLSelectElement>(doc, '#unfold-part');
    part.addEventListener('change', () => void app.edit({ unfold: { ...app.state.unfold, part: readPart(part.value, 'show') } }, 'none'));
    $<HTMLButtonElement>(doc, '#unfold-cancel').addEventListener('click', () => {
      this.lane.cancel();
      this.solvedFor = '';
      this.progress(undefined);
      this.readout('stopped: press “unfold” to compute again');
      this.showStart(true);
    });
    $<HTMLButtonElement>(doc, '#unfold-start').addEventListener('click', () => void this.solve(true));
    for (const id of ['#energy-low', '#energy-high']) $<HTMLInputElement>(doc, id).addEventListener('change', () => this.schedule());
    for (const button of doc.querySelectorAll<HTMLButtonElement>('[data-unfold-export]')) {
      button.addEventListener('click', () => void this.export(button.dataset.unfoldExport!));
    }
    $<HTMLElement>(doc, '#unfolded-host').addEventListener('pointermove', (event) => this.hover(event));
    app.onChange.push(() => this.schedule());
    app.onSpectra.push(() => this.schedule());
    this.schedule();
  }

  private signed(x: number): string {
    return `${x >= 0 ? '+' : '−'} ${Math.abs(x)}`;
  }

  /** One refresh per task, after the controller has finished the edit (E_F moves after the listeners run). */
  private schedule(): void {
    if (this.scheduled) return;
    this.scheduled = true;
    void nextTask().then(() => {
      this.scheduled = false;
      this.refresh();
    });
  }

  private refresh(): void {
    const cut = $<HTMLInputElement>(this.doc, '#cut-energy');
    if (!cut.classList.contains('invalid') && this.doc.activeElement !== cut) cut.value = String(this.app.state.unfold.cut);
    $<HTMLSelectElement>(this.doc, '#unfold-part').value = this.app.state.unfold.part;
    if (this.sheetKey() !== this.solvedFor) {
      // The bands first: while the model worker solves the new sheet, wait (its onSpectra schedules us again), so
      // that the two solves never share the cores and an edit reaches the bands figure as fast as before.
      if (this.app.model.busy) {
        // A solve of the previous sheet would hold a core the bands need: stop it (the lane ends its worker).
        if (this.solving) {
          this.solveGeneration++;
          this.lane.cancel();
          this.solving = false;
        }
        return;
      }
      void this.solve(false);
      return;
    }
    this.requestDraw();
  }

  /** The sheet and parameters by content: a new mesh or an undo makes a new resolved sheet with the same atoms, which needs no new solve. */
  private sheetKey(): string {
    const r = this.app.resolved;
    return JSON.stringify([r.label, r.cellPattern ?? r.sheet, parameterSet(this.app.state.params)]);
  }

  /** The resolved sheet on its triangular lattice (a pattern at its smallest cell, or an explicit sheet recognised). */
  private unfoldingOfSheet(): UnfoldingSheet | undefined {
    const r = this.app.resolved;
    return r.cellPattern ? patternUnfolding(r.cellPattern) : sheetUnfolding(r.sheet);
  }

  private estimateSeconds(unfolding: UnfoldingSheet): number {
    const n = unfolding.sheet.atoms.length;
    const perK = VECTORS_PER_CUBE * (isPlanar(unfolding.sheet) ? (3 * n) ** 3 + n ** 3 : (4 * n) ** 3);
    return perK * (PATH_POINTS + 0.38 * CUT_PIXELS * CUT_PIXELS);
  }

  private async solve(asked: boolean): Promise<void> {
    const generation = ++this.solveGeneration;
    this.solvedFor = this.sheetKey();
    this.unfolding = this.unfoldingOfSheet();
    this.drawn = undefined;
    if (!this.unfolding) {
      this.lane.cancel();
      this.solving = false;
      this.clearFigures();
      this.readout(`${this.app.resolved.label}: ${NOT_TRIANGULAR}.`);
      this.showStart(false);
      return;
    }
    const seconds = this.estimateSeconds(this.unfolding);
    if (!asked && seconds > AUTO_SECONDS) {
      this.lane.cancel();
      this.solving = false;
      this.clearFigures();
      this.readout(`${this.app.resolved.label}: ${this.unfolding.sheet.atoms.length} atoms per cell; unfolding takes about ${Math.round(seconds)} s — press “unfold” to start.`);
      this.showStart(true);
      return;
    }
    this.showStart(false);
    const input: SolveInput = {
      label: this.app.resolved.label, unfolding: this.unfolding, params: parameterSet(this.app.state.params),
      pathPoints: PATH_POINTS, cutPixels: CUT_PIXELS,
    };
    this.solving = true;
    this.progress(0, 1, 'k-points');
    try {
      await this.lane.run('solve', input, (done, total, what) => this.progress(done, total, what));
    } catch (error) {
      if (generation === this.solveGeneration) this.solving = false;
      if (error instanceof Cancelled) return;
      this.progress(undefined);
      this.app.notices.show(error instanceof Error ? error.message : String(error));
      return;
    }
    if (generation !== this.solveGeneration) return;
    this.solving = false;
    this.progress(undefined);
    this.requestDraw();
  }

  private drawInput(): DrawInput | undefined {
    const spectra = this.app.spectra;
    if (!spectra) return undefined;
    const { low, high } = this.app.energyWindow;
    return {
      smearing: this.app.state.smearing, fermi: spectra.fermi, energyRange: SpectrumView.energyRange(spectra, low, high), rows: ROWS,
      cutEnergy: spectra.fermi + this.app.state.unfold.cut, part: this.app.state.unfold.part,
    };
  }

  /** Draws with the latest inputs once the worker is free; never cancels a running job. */
  private requestDraw(): void {
    if (this.solving || !this.unfolding) return;
    if (this.drawing) {
      this.drawWanted = true;
      return;
    }
    void this.drawLoop();
  }

  private async drawLoop(): Promise<void> {
    this.drawing = true;
    try {
      do {
        this.drawWanted = false;
        const input = this.drawInput();
        if (!input) break;
        const output = await this.lane.run<DrawOutput>('draw', input);
        this.render(output);
      } while (this.drawWanted && !this.solving);
    } catch (error) {
      if (error instanceof JobError && error.message === NO_UNFOLDING) {
        this.solvedFor = '';
        this.schedule();
      } else if (!(error instanceof Cancelled)) {
        this.app.notices.show(error instanceof Error ? error.message : String(error));
      }
    } finally {
      this.drawing = false;
    }
  }

  private render(output: DrawOutput): void {
    const started = performance.now();
    this.drawn = output;
    const doc = this.doc;
    const unfoldedHost = $<HTMLElement>(doc, '#unfolded-host');
    const width = Math.max(360, Math.min(760, unfoldedHost.clientWidth || 520));
    const height = Math.round(Math.max(340, Math.min(520, width * 0.78)));
    this.unfoldedSvg = unfoldedFigure(output.unfolded, { document: doc, style: 'screen', width, height });
    unfoldedHost.replaceChildren(this.unfoldedSvg);
    this.cutSvg = cutFigure(output.cut, { document: doc, style: 'screen', width: 300, height: 330 });
    $<HTMLElement>(doc, '#cut-host').replaceChildren(this.cutSvg);
    const u = output.unfolded;
    const eta = formatFraction(u.sites - u.atoms, u.sites);
    const shift = this.app.state.unfold.cut;
    this.readout(`${u.sheetLabel}: ${u.atoms} atoms on ${u.sites} sites (η = ${eta}) unfolded onto the triangular lattice of spacing ${u.bond} Å; at every k the weights add up to 4(1 − η) = ${((4 * u.atoms) / u.sites).toFixed(3)}. Cut at E_F${shift === 0 ? '' : ` ${this.signed(shift)} eV`}.`);
    this.renderMs = performance.now() - started;
  }

  private hover(event: PointerEvent): void {
    const svg = this.unfoldedSvg;
    const data = this.drawn?.unfolded;
    const matrix = svg?.getScreenCTM();
    if (!svg || !data || !matrix) return;
    const point = new DOMPoint(event.clientX, event.clientY).matrixTransform(matrix.inverse());
    const x = readLinear(svg, 'k-scale');
    const y = readLinear(svg, 'energy-scale');
    const plot = svg.getAttribute('data-plot')?.split(' ').map(Number);
    if (!x || !y || !plot) return;
    const distance = x.invert(point.x - plot[0]);
    const energy = y.invert(point.y - plot[1]);
    if (!(distance >= 0 && distance <= x.domain[1] && energy >= y.domain[0] && energy <= y.domain[1])) return;
    let index = 0;
    while (index + 1 < data.path.count && data.path.distance[index + 1] <= distance) index++;
    const relative = energy - data.fermi;
    $<HTMLElement>(this.doc, '#unfold-hover').textContent = `${pathPlace(data.path.labels, index)} · E − E_F = ${relative >= 0 ? '+' : '−'}${Math.abs(relative).toFixed(2)} eV`;
  }

  private async export(kind: string): Promise<void> {
    const drawn = this.drawn;
    if (!drawn) return this.app.notices.show('the unfolded bands are still being computed; try again in a moment', 'info');
    const [figure, format] = kind.split('-');
    const options = { document: this.doc, style: 'publication' as FigureStyle };
    const svg = figure === 'cut' ? cutFigure(drawn.cut, options) : unfoldedFigure(drawn.unfolded, options);
    const name = `${drawn.unfolded.sheetLabel}-${figure}`;
    if (format === 'svg') download(this.doc, `${name}.svg`, new Blob([svgText(svg)], { type: 'image/svg+xml' }));
    else download(this.doc, `${name}.png`, await svgToPng(svg));
  }

  private clearFigures(): void {
    this.unfoldedSvg = undefined;
    this.cutSvg = undefined;
    $<HTMLElement>(this.doc, '#unfolded-host').replaceChildren();
    $<HTMLElement>(this.doc, '#cut-host').replaceChildren();
  }

  private readout(text: string): void {
    $<HTMLElement>(this.doc, '#unfold-readout').textContent = text;
  }

  private showStart(show: boolean): void {
    $<HTMLButtonElement>(this.doc, '#unfold-start').hidden = !show;
  }

  private progress(done: number | undefined, total = 1, what = ''): void {
    const box = $<HTMLElement>(this.doc, '#unfold-progress');
    box.hidden = done === undefined;
    if (done === undefined) return;
    box.querySelector('progress')!.value = total > 0 ? done / total : 0;
    box.querySelector('span')!.textContent = `${done} / ${total} ${what}`;
  }
}
