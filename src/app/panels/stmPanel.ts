/**
 * The STM panel: the model picture of the current sheet at the tip set in the panel; a measured picture (a file, or
 * the DEMO synthetic one) with its fitted lattice; and the candidate patterns ranked by how alike their model
 * pictures look, a click loading one into the sheet and bands (whose model picture then sits beside the measured
 * one). Every job runs in the STM worker, on three lanes so that no job cancels another kind.
 */
import { stmPictureFigure } from '../../figures/stmPicture.ts';
import type { FigureStyle, StmPictureData } from '../../figures/types.ts';
import type { App } from '../app.ts';
import { parameterSet, type StmState } from '../state.ts';
import {
  PICTURE_LIMITS, readBackground, readBias, readCells, readHeight, readMode, readPixels, readPixelSize, readSites, readTop,
} from '../stmFields.ts';
import { SUBSTRATES } from '../../substrate/substrates.ts';
import { tipLine, type CandidateFit, type MatchOutput, type MeasuredOutput, type RankedCandidate, type SimulateOutput } from '../stmJobs.ts';
import { Cancelled, WorkerLane } from '../worker/client.ts';
import { readField } from './readField.ts';

const $ = <T extends Element>(doc: Document, selector: string) => doc.querySelector<T>(selector)!;

/** Wait (ms) after the last edit before a new model picture is asked for (a doping drag sends many). */
const SETTLE_MS = 200;

export class StmPanel {
  private readonly pictureLane: WorkerLane;
  private readonly measureLane: WorkerLane;
  private readonly matchLane: WorkerLane;
  /** The pictures drawn now (for the exports). */
  simulated: StmPictureData | undefined;
  measured: MeasuredOutput | undefined;
  ranked: MatchOutput | undefined;
  /** The file the user opened last, kept until a pixel size lets it be analysed. */
  private pending: { name: string; bytes: Uint8Array } | undefined;
  private shownStm: StmState | undefined;
  private deps: unknown[] = [];
  private timer: ReturnType<typeof setTimeout> | undefined;
  private selectedKey = '';

  constructor(private readonly app: App, private readonly doc: Document, createWorker: () => Worker) {
    this.pictureLane = new WorkerLane(createWorker, 'STM picture');
    this.measureLane = new WorkerLane(createWorker, 'measured picture');
    this.matchLane = new WorkerLane(createWorker, 'match');
    const tip = $<HTMLFormElement>(doc, '#stm-tip-form');
    for (const name of ['bias', 'height', 'mode']) this.field(tip, name).addEventListener('change', () => this.readTip());
    for (const name of ['cells', 'pixels', 'sameWidth']) this.field(tip, name).addEventListener('change', () => this.refresh(true));
    const picture = $<HTMLFormElement>(doc, '#stm-picture-form');
    $<HTMLInputElement>(doc, '#stm-file').addEventListener('change', (event) => void this.openFile(event.target as HTMLInputElement));
    for (const name of ['pixelSize', 'background']) this.field(picture, name).addEventListener('change', () => void this.analysePending());
    $<HTMLButtonElement>(doc, '#stm-demo').addEventListener('click', () => void this.demo());
    const metals = $<HTMLFormElement>(doc, '#stm-match-form').elements.namedItem('metal') as HTMLSelectElement;
    for (const metal of SUBSTRATES) metals.add(new Option(metal.title, metal.name));
    $<HTMLFormElement>(doc, '#stm-match-form').addEventListener('submit', (event) => {
      event.preventDefault();
      void this.match();
    });
    $<HTMLButtonElement>(doc, '#stm-cancel').addEventListener('click', () => {
      for (const lane of [this.pictureLane, this.measureLane, this.matchLane]) lane.cancel();
      this.busy(undefined);
      this.app.notices.show('STM: stopped; the pictures and the table show the last finished results', 'info');
    });
    app.onChange.push(() => this.refresh());
    this.refresh();
  }

  private field(form: HTMLFormElement, name: string): HTMLInputElement {
    return form.elements.namedItem(name) as HTMLInputElement;
  }

  /** Runs a field reader: a refusal is named (panel line and notice), the field outlined, its text kept. */
  private read<T>(input: HTMLInputElement, reader: (text: string) => T, errors: string[]): T | undefined {
    return readField(input, reader, errors);
  }

  private showErrors(errors: string[], after = 'the last good value is used'): void {
    $<HTMLElement>(this.doc, '#stm-error').textContent = errors.join('; ');
    for (const message of errors) this.app.notices.show(`${message} — ${after}`);
  }

  // --- the tip and the model picture ---------------------------------------------------------------------------

  private readTip(): void {
    const form = $<HTMLFormElement>(this.doc, '#stm-tip-form');
    const errors: string[] = [];
    const stm = { ...this.app.state.stm };
    stm.bias = this.read(this.field(form, 'bias'), readBias, errors) ?? stm.bias;
    stm.height = this.read(this.field(form, 'height'), readHeight, errors) ?? stm.height;
    stm.mode = this.read(this.field(form, 'mode'), readMode, errors) ?? stm.mode;
    this.showErrors(errors);
    const old = this.app.state.stm;
    if (stm.bias === old.bias && stm.height === old.height && stm.mode === old.mode) return;
    this.shownStm = stm; // the fields already show it (and any refused text stays)
    void this.app.edit({ stm }, 'none');
  }

  private fillFields(stm: StmState): void {
    const tip = $<HTMLFormElement>(this.doc, '#stm-tip-form');
    this.field(tip, 'bias').value = String(stm.bias);
    this.field(tip, 'height').value = String(stm.height);
    this.field(tip, 'mode').value = stm.mode;
    const match = $<HTMLFormElement>(this.doc, '#stm-match-form');
    this.field(match, 'sites').value = stm.sites.join('-');
    this.field(match, 'top').value = String(stm.top);
    this.field(match, 'metal').value = stm.metal ?? '';
    for (const input of this.doc.querySelectorAll('.stm-inputs .invalid')) input.classList.remove('invalid');
  }

  private refresh(force = false): void {
    const stm = this.app.state.stm;
    if (stm !== this.shownStm) {
      this.shownStm = stm;
      this.fillFields(stm);
    }
    const a = this.app;
    const deps = [a.resolved, a.state.params, a.state.doping, a.state.smearing, stm.bias, stm.height, stm.mode];
    if (!force && deps.every((d, i) => d === this.deps[i])) return;
    this.deps = deps;
    // A picture of the previous state would hold a core the new bands need: stop it now, not when the next starts.
    if (this.pictureLane.busy) this.pictureLane.cancel();
    clearTimeout(this.timer);
    this.timer = setTimeout(() => void this.simulate(), SETTLE_MS);
  }

  private async simulate(): Promise<void> {
    const form = $<HTMLFormElement>(this.doc, '#stm-tip-form');
    const errors: string[] = [];
    const cells = this.sameWidthCells() ?? this.read(this.field(form, 'cells'), readCells, errors);
    const pixels = this.read(this.field(form, 'pixels'), readPixels, errors);
    if (cells === undefined || pixels === undefined) return this.showErrors(errors, 'the picture is not redrawn until it is corrected');
    const r = this.app.resolved;
    const s = this.app.state;
    // The status line leaves the page when a picture is drawn over it: made anew when a later picture fails.
    const status = this.doc.querySelector<HTMLElement>('#stm-model-status') ?? Object.assign(this.doc.createElement('p'), { id: 'stm-model-status', className: 'muted' });
    this.busy('model picture…');
    try {
      const output = await this.pictureLane.run<SimulateOutput>('simulate', {
        label: r.label, sheet: r.sheet, params: parameterSet(s.params), doping: s.doping, smearing: s.smearing,
        bias: s.stm.bias, height: s.stm.height, mode: s.stm.mode, cells, pixels,
      }, (done, total, what) => this.progress(done, total, what));
      this.simulated = output.figure;
      this.draw('#stm-model-host', output.figure);
    } catch (error) {
      if (error instanceof Cancelled) return;
      const message = error instanceof Error ? error.message : String(error);
      status.textContent = `no model picture: ${message}`;
      // The last picture stays, marked as not the current sheet's.
      const host = $<HTMLElement>(this.doc, '#stm-model-host');
      if (!host.contains(status)) host.prepend(status);
      this.app.notices.show(`STM: ${message}`);
    } finally {
      this.busy(undefined);
    }
  }

  /**
   * Cells per side that make the model picture about as wide as the measured one (renderStm's side is
   * cells · max(|A1|, |A2|)), when that box is ticked and a measured picture is open; shown in the cells field.
   */
  private sameWidthCells(): number | undefined {
    const form = $<HTMLFormElement>(this.doc, '#stm-tip-form');
    const box = this.field(form, 'sameWidth');
    const measured = this.measured;
    this.field(form, 'cells').disabled = box.checked && measured !== undefined;
    if (!box.checked || !measured) return undefined;
    const [a, b] = this.app.resolved.sheet.cell;
    const longest = Math.max(Math.hypot(a[0], a[1]), Math.hypot(b[0], b[1]));
    const cells = Math.min(PICTURE_LIMITS.cells[1], Math.max(PICTURE_LIMITS.cells[0], Math.round((measured.analysis.width * measured.analysis.pixelSize) / longest)));
    this.field(form, 'cells').value = String(cells);
    this.field(form, 'cells').classList.remove('invalid');
    return cells;
  }

  private draw(selector: string, data: StmPictureData): void {
    const host = $<HTMLElement>(this.doc, selector);
    host.replaceChildren(stmPictureFigure(data, { document: this.doc }));
  }

  /** A picture in the publication look, for "Save and share". */
  figure(kind: 'stm' | 'stm-measured', style: FigureStyle = 'publication'): SVGSVGElement | undefined {
    const data = kind === 'stm' ? this.simulated : this.measured?.figure;
    return data ? stmPictureFigure(data, { document: this.doc, style }) : undefined;
  }

  // --- the measured picture ------------------------------------------------------------------------------------

  private async openFile(input: HTMLInputElement): Promise<void> {
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    this.pending = { name: file.name, bytes: new Uint8Array(await file.arrayBuffer()) };
    await this.analysePending();
  }

  private async analysePending(): Promise<void> {
    const pending = this.pending;
    if (!pending) return;
    const form = $<HTMLFormElement>(this.doc, '#stm-picture-form');
    const errors: string[] = [];
    const pixelSize = this.read(this.field(form, 'pixelSize'), readPixelSize, errors);
    const background = this.read(this.field(form, 'background'), readBackground, errors);
    if (pixelSize === undefined || background === undefined) {
      return this.showErrors(errors, `${pending.name} waits for it; the picture shown is kept`);
    }
    $<HTMLElement>(this.doc, '#stm-error').textContent = '';
    await this.measure('analyse', { name: pending.name, bytes: pending.bytes, pixelSize, background });
  }

  private async demo(): Promise<void> {
    this.pending = undefined;
    const ok = await this.measure('demo', { params: parameterSet(this.app.state.params) });
    if (ok) {
      const form = $<HTMLFormElement>(this.doc, '#stm-picture-form');
      this.field(form, 'pixelSize').value = String(this.measured!.analysis.pixelSize);
      this.field(form, 'background').value = 'plane';
      this.field(form, 'pixelSize').classList.remove('invalid');
    }
  }

  /** Analyses a picture; on success shows it and ranks the candidates, on failure keeps everything shown. */
  private async measure(job: 'analyse' | 'demo', input: unknown): Promise<boolean> {
    this.busy(job === 'demo' ? 'making the DEMO picture…' : 'reading the picture…');
    try {
      this.measured = await this.measureLane.run<MeasuredOutput>(job, input);
    } catch (error) {
      if (!(error instanceof Cancelled)) {
        const message = error instanceof Error ? error.message : String(error);
        this.showErrors([message], this.measured ? `the picture shown (${this.measured.name}) and its table are kept` : 'nothing else changed');
      }
      return false;
    } finally {
      this.busy(undefined);
    }
    $<HTMLElement>(this.doc, '#stm-error').textContent = '';
    this.draw('#stm-measured-host', this.measured.figure);
    if (this.field($<HTMLFormElement>(this.doc, '#stm-tip-form'), 'sameWidth').checked) this.refresh(true);
    this.ranked = undefined;
    $<HTMLTableSectionElement>(this.doc, '#stm-candidates tbody').replaceChildren();
    await this.match();
    return true;
  }

  // --- matching ------------------------------------------------------------------------------------------------

  private async match(): Promise<void> {
    const form = $<HTMLFormElement>(this.doc, '#stm-match-form');
    const errors: string[] = [];
    const sites = this.read(this.field(form, 'sites'), readSites, errors);
    const top = this.read(this.field(form, 'top'), readTop, errors);
    const summary = $<HTMLElement>(this.doc, '#stm-summary');
    if (sites === undefined || top === undefined) return this.showErrors(errors, 'the table is kept until it is corrected');
    const stm = this.app.state.stm;
    const metal = this.field(form, 'metal').value || null;
    if (sites.join('-') !== stm.sites.join('-') || top !== stm.top || metal !== stm.metal) {
      this.shownStm = { ...stm, sites, top, metal };
      await this.app.edit({ stm: this.shownStm }, 'none');
    }
    const measured = this.measured;
    if (!measured) {
      summary.textContent = 'Open a measured picture first (or press “DEMO picture”).';
      return;
    }
    const s = this.app.state;
    this.busy('ranking patterns…');
    summary.textContent = `ranking the isolated-hole patterns with ${sites.join('–')} sites against ${measured.name}…`;
    try {
      this.ranked = await this.matchLane.run<MatchOutput>('match', {
        analysis: measured.analysis, params: parameterSet(s.params), sites, top,
        bias: s.stm.bias, height: s.stm.height, mode: s.stm.mode, smearing: s.smearing, doping: s.doping, metal,
      }, (done, total, what) => this.progress(done, total, what));
      this.drawTable(measured.name);
    } catch (error) {
      if (error instanceof Cancelled) {
        summary.textContent = 'ranking stopped';
        return;
      }
      summary.textContent = error instanceof Error ? error.message : String(error);
    } finally {
      this.busy(undefined);
    }
  }

  private drawTable(name: string): void {
    const ranked = this.ranked!;
    const s = this.app.state.stm;
    const summary = $<HTMLElement>(this.doc, '#stm-summary');
    const unscored = ranked.unscored > 0 ? ` ${ranked.unscored} fitting pattern(s) not scored: no state in the bias window (E_F in a gap of the model); a larger |V| reaches them.` : '';
    summary.textContent = ranked.candidates.length === 0
      ? `No pattern with a fitting cell among ${ranked.examined} examined: widen the sites, or check the pixel size.${unscored}`
      : `${name}: ${ranked.fitting} of ${ranked.examined} isolated-hole patterns fit the lattice${s.metal ? ` (${ranked.fittingByCoincidence} only through a coincidence cell with the metal: lattice matches, scored on the free sheet's model, the moiré not modelled)` : ''}; the best ${ranked.candidates.length} by score at ${tipLine(s)}.${unscored} Click a row to load it into the sheet and see its model picture beside the measured one.`;
    const body = $<HTMLTableSectionElement>(this.doc, '#stm-candidates tbody');
    body.replaceChildren(...ranked.candidates.map((c, i) => this.row(c, i + 1)));
  }

  private row(candidate: RankedCandidate, rank: number): HTMLTableRowElement {
    const row = this.doc.createElement('tr');
    const key = JSON.stringify(candidate.pattern);
    row.dataset.name = candidate.name;
    row.setAttribute('aria-selected', String(key === this.selectedKey));
    const cells = [String(rank), candidate.name, String(candidate.sites), String(candidate.holes), candidate.eta.toFixed(4), candidate.score.toFixed(3), fitText(candidate.fit)];
    for (const text of cells) row.insertCell().textContent = text;
    row.title = `supercell ${JSON.stringify(candidate.pattern.supercell)}, holes ${candidate.pattern.vacancies.map(([i, j]) => `(${i},${j})`).join(' ')}${candidate.index > 1 ? `; its cell is ${candidate.index}× the fitted one` : ''}${fitTitle(candidate.fit)}`;
    row.addEventListener('click', () => {
      this.selectedKey = key;
      for (const other of row.parentElement!.children) other.setAttribute('aria-selected', String(other === row));
      this.app.showPattern(candidate.name, candidate.pattern);
    });
    return row;
  }

  // --- progress ------------------------------------------------------------------------------------------------

  private busy(what: string | undefined): void {
    const box = $<HTMLElement>(this.doc, '#stm-progress');
    const running = [this.pictureLane, this.measureLane, this.matchLane].some((lane) => lane.busy);
    if (what !== undefined) {
      box.hidden = false;
      box.querySelector('progress')!.removeAttribute('value');
      box.querySelector('span')!.textContent = what;
    } else if (!running) {
      box.hidden = true;
    }
  }

  private progress(done: number, total: number, what: string): void {
    const box = $<HTMLElement>(this.doc, '#stm-progress');
    const bar = box.querySelector('progress')!;
    if (total > 0) bar.value = done / total;
    else bar.removeAttribute('value');
    box.querySelector('span')!.textContent = total > 0 ? `${done} / ${total} ${what}` : `${done} ${what}`;
  }
}

/** The table's "fits by" cell: own cell, or the coincidence cell in short. */
function fitText(fit: CandidateFit): string {
  if (fit.kind === 'cell') return 'own cell';
  return `${fit.wood ?? `${fit.sites} metal atoms`}, ${fit.angleDeg.toFixed(1)}°, ${(100 * fit.strain).toFixed(2)} %`;
}

function fitTitle(fit: CandidateFit): string {
  if (fit.kind === 'cell') return '';
  const rows = (r: number[][]) => `[${r.map((x) => `[${x.join(',')}]`).join(',')}]`;
  return `; a coincidence cell on ${fit.metal}: ${fit.sheetCells} sheet cells on ${fit.sites} metal atoms, the sheet turned ${fit.angleDeg.toFixed(2)}°, strain ${(100 * fit.strain).toFixed(2)} %, sheet rows ${rows(fit.sheetSupercell)} → metal rows ${rows(fit.substrateSupercell)} (a lattice match; the moiré contrast is not modelled)`;
}
