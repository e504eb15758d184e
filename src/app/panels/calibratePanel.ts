/**
 * The "Fit to your bands" panel: the user's reference bands (a file, or the DEMO ones at start) fitted to the sheet
 * on screen by the calibrate worker (src/app/calibrateJobs.ts), the fitted bands drawn against the reference with
 * calibrationFigure, the parameters with their uncertainties, and the fitted set kept as the user's own parameter set
 * (the Model panel's "yours: …", through app.edit, so undo and the link follow). A refused file or field is named;
 * the reference and the fit shown stay until a new one succeeds.
 */
import { calibrationFigure } from '../../figures/calibration.ts';
import { ValidationError, invalid } from '../../validate/invalid.ts';
import { REFERENCE_LIMITS } from '../../io/referenceBandsFile.ts';
import { DEFAULT_WEIGHT_WIDTH } from '../../learn/calibrate/bandWeights.ts';
import type { ModelParameter } from '../../learn/calibrate/modelParameters.ts';
import { findSheetPreset } from '../../lattice/presets.ts';
import type { App } from '../app.ts';
import { CALIBRATE_FIELD_NAMES as FIELDS, keptName, readBandRange, readBlock, readWeightWidth } from '../calibrateFields.ts';
import type { FitInput, FitOutput, LoadedReference } from '../calibrateJobs.ts';
import { download, svgText, svgToPng } from '../download.ts';
import { parameterSet } from '../state.ts';
import { Cancelled, WorkerLane } from '../worker/client.ts';
import { readField } from './readField.ts';

const $ = <T extends Element>(doc: Document, selector: string) => doc.querySelector<T>(selector)!;

const LABELS: Record<ModelParameter, string> = {
  s: 'εs (eV)', p: 'εp (eV)', ss_sigma: 'V_ssσ (eV)', sp_sigma: 'V_spσ (eV)', pp_sigma: 'V_ppσ (eV)', pp_pi: 'V_ppπ (eV)', exponent: 'exponent',
};

export class CalibratePanel {
  private readonly lane: WorkerLane;
  /** The reference bands loaded now, and the fit drawn now. */
  loaded: LoadedReference | undefined;
  fit: FitOutput | undefined;
  /** A preset the user opened from the panel to fit its reference to: fitted once the page shows it. */
  private fitWhenShown: string | undefined;
  private readonly form: HTMLFormElement;

  constructor(private readonly app: App, private readonly doc: Document, createWorker: () => Worker) {
    this.lane = new WorkerLane(createWorker, 'calibrate');
    this.form = $<HTMLFormElement>(doc, '#calibrate-form');
    $<HTMLInputElement>(doc, '#calibrate-file').addEventListener('change', (event) => void this.openFile(event.target as HTMLInputElement));
    $<HTMLButtonElement>(doc, '#calibrate-demo').addEventListener('click', () => void this.loadDemo());
    this.form.addEventListener('submit', (event) => {
      event.preventDefault();
      void this.run();
    });
    for (const name of ['shift', 'block', 'modelBands', 'referenceBands', 'weightWidth', 'equal', 'exponent', 'cutoff']) {
      this.field(name).addEventListener('change', () => {
        if (this.loaded) void this.run();
      });
    }
    $<HTMLButtonElement>(doc, '#calibrate-cancel').addEventListener('click', () => {
      this.lane.cancel();
      this.busy(undefined);
      this.app.notices.show('fit: stopped; the figure and the table show the last finished fit', 'info');
    });
    $<HTMLFormElement>(doc, '#calibrate-keep-form').addEventListener('submit', (event) => {
      event.preventDefault();
      this.keep();
    });
    $<HTMLButtonElement>(doc, '#calibrate-svg').addEventListener('click', () => this.saveFigure('svg'));
    $<HTMLButtonElement>(doc, '#calibrate-png').addEventListener('click', () => void this.saveFigure('png'));
    $<HTMLButtonElement>(doc, '#calibrate-params').addEventListener('click', () => this.saveParameters());
    app.onChange.push(() => this.sheetChanged());
  }

  /** Loads the DEMO reference bands and fits them when the page shows their sheet. */
  async start(): Promise<void> {
    await this.loadDemo();
  }

  private field(name: string): HTMLInputElement {
    return this.form.elements.namedItem(name) as HTMLInputElement;
  }

  private error(message: string, kept: string): void {
    $<HTMLElement>(this.doc, '#calibrate-error').textContent = message;
    this.app.notices.show(`${message} — ${kept}`);
  }

  private busy(what: string | undefined): void {
    const box = $<HTMLElement>(this.doc, '#calibrate-progress');
    box.hidden = what === undefined;
    if (what !== undefined) box.querySelector('span')!.textContent = what;
    $<HTMLButtonElement>(this.doc, '#calibrate-run').disabled = what !== undefined;
  }

  // --- the reference bands -------------------------------------------------------------------------------------

  private async loadDemo(): Promise<void> {
    try {
      this.setReference(await this.lane.run<LoadedReference>('demo', {}));
      await this.runIfItsSheet();
    } catch (error) {
      if (!(error instanceof Cancelled)) this.error(error instanceof Error ? error.message : String(error), 'the reference bands shown are kept');
    }
  }

  private async openFile(input: HTMLInputElement): Promise<void> {
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    const kept = this.loaded ? `the reference bands ${this.loaded.label} and their fit are kept` : 'nothing was loaded';
    try {
      if (file.size > REFERENCE_LIMITS.textBytes) invalid(FIELDS.file, file.name, `larger than ${REFERENCE_LIMITS.textBytes} bytes`);
      if (file.size === 0) invalid(FIELDS.file, file.name, 'empty file');
      const loaded = await this.lane.run<LoadedReference>('read', { name: file.name, text: await file.text() });
      $<HTMLElement>(this.doc, '#calibrate-error').textContent = '';
      this.setReference(loaded);
      await this.run();
    } catch (error) {
      if (error instanceof Cancelled) return;
      this.error(error instanceof Error ? error.message : String(error), kept);
    }
  }

  private setReference(loaded: LoadedReference): void {
    this.loaded = loaded;
    this.describeReference();
  }

  /** The reference line: what the file holds, and whether it says it belongs to another sheet. */
  private describeReference(): void {
    const line = $<HTMLElement>(this.doc, '#calibrate-reference');
    const loaded = this.loaded;
    if (!loaded) return void line.replaceChildren();
    const r = loaded.reference;
    const parts = [`${loaded.label}: ${r.count} k-points, ${r.bands} bands per k-point${r.fermi !== undefined ? `, E_F ${r.fermi} eV` : ''}.`];
    if (r.title) parts.push(r.title);
    line.replaceChildren(parts.join(' '));
    const other = this.otherSheet();
    if (other) {
      const note = this.doc.createElement('span');
      note.className = 'calibrate-stale';
      note.textContent = ` The file says these are bands of ${other}; the page shows ${this.app.resolved.label}. `;
      line.append(note);
      if (findSheetPreset(other)) {
        const open = this.doc.createElement('button');
        open.type = 'button';
        open.id = 'calibrate-open-sheet';
        open.textContent = `open ${other}`;
        open.addEventListener('click', () => {
          this.fitWhenShown = other;
          void this.app.edit({ sheet: { kind: 'preset', name: other }, pick: undefined }, 'spectra');
        });
        line.append(open);
      }
    }
  }

  /** The sheet the reference names, when it is not the one on the page. */
  private otherSheet(): string | undefined {
    const named = this.loaded?.reference.sheet;
    return named !== undefined && named !== this.app.resolved.label ? named : undefined;
  }

  private async runIfItsSheet(): Promise<void> {
    if (!this.otherSheet()) return this.run();
    const status = $<HTMLElement>(this.doc, '#calibrate-status');
    status.textContent = `The reference bands are of ${this.loaded!.reference.sheet}: open it to fit them, or press “fit to this sheet” to fit them to ${this.app.resolved.label} anyway.`;
  }

  private sheetChanged(): void {
    this.describeReference();
    if (this.fitWhenShown !== undefined && this.app.resolved.label === this.fitWhenShown) {
      this.fitWhenShown = undefined;
      void this.run();
      return;
    }
    this.describeFit();
  }

  // --- the fit -------------------------------------------------------------------------------------------------

  /** Reads the fields one by one: a refused one is outlined and named, and the fit is not run. */
  private readFields(): Omit<FitInput, 'sheet' | 'sheetLabel' | 'reference' | 'referenceLabel' | 'start' | 'fittedAt'> | undefined {
    const errors: string[] = [];
    const read = <T>(name: string, reader: (text: string) => T): T | undefined => readField(this.field(name), reader, errors);
    const block = read('block', readBlock);
    const modelBands = read('modelBands', (text) => readBandRange(FIELDS.modelBands, text));
    const referenceBands = read('referenceBands', (text) => readBandRange(FIELDS.referenceBands, text));
    const weightWidth = read('weightWidth', (text) => readWeightWidth(text, this.field('equal').checked, DEFAULT_WEIGHT_WIDTH));
    if (errors.length > 0 || block === undefined || weightWidth === undefined) {
      this.error(errors.join('; '), 'the fit shown is kept; correct the field and fit again');
      return undefined;
    }
    return {
      shift: this.field('shift').checked, block, weightWidth,
      freeExponent: this.field('exponent').checked, scanCutoff: this.field('cutoff').checked,
      ...(modelBands ? { modelBands } : {}), ...(referenceBands ? { referenceBands } : {}),
    };
  }

  /** Fits the loaded reference to the sheet on the page, starting from the page's parameter set. */
  async run(): Promise<void> {
    const loaded = this.loaded;
    if (!loaded) return;
    const fields = this.readFields();
    if (!fields) return;
    const r = this.app.resolved;
    const input: FitInput = {
      ...fields, sheet: r.sheet, sheetLabel: r.label, reference: loaded.reference, referenceLabel: loaded.label,
      start: parameterSet(this.app.state.params), fittedAt: new Date().toISOString().slice(0, 10),
    };
    this.busy('fitting…');
    try {
      const output = await this.lane.run<FitOutput>('fit', input, (done, total, what) => {
        const box = $<HTMLElement>(this.doc, '#calibrate-progress');
        box.querySelector('progress')!.value = total > 0 ? done / total : 0;
        box.querySelector('span')!.textContent = `${done} / ${total} ${what}`;
      });
      $<HTMLElement>(this.doc, '#calibrate-error').textContent = '';
      this.fit = output;
      this.draw();
    } catch (error) {
      if (error instanceof Cancelled) return;
      this.error(error instanceof Error ? error.message : String(error), this.fit ? 'the fit shown is kept' : 'nothing was fitted');
    } finally {
      this.busy(undefined);
    }
  }

  private draw(): void {
    const fit = this.fit;
    if (!fit) return;
    $<HTMLElement>(this.doc, '#calibrate-host').replaceChildren(calibrationFigure(fit.figure, { document: this.doc }));
    const body = $<HTMLTableElement>(this.doc, '#calibrate-table').tBodies[0];
    body.replaceChildren(...fit.rows.map((row) => {
      const tr = this.doc.createElement('tr');
      if (row.held) {
        tr.className = 'held';
        tr.title = `held: ${row.held}`;
      }
      tr.insertCell().textContent = LABELS[row.name];
      const value = tr.insertCell();
      value.className = 'num';
      value.textContent = row.value.toFixed(row.name === 'exponent' ? 3 : 4);
      const sigma = tr.insertCell();
      sigma.className = 'num';
      sigma.textContent = row.held ? 'held' : row.sigma === null ? 'not fixed by these bands' : row.sigma.toPrecision(2);
      return tr;
    }));
    const keep = $<HTMLFormElement>(this.doc, '#calibrate-keep-form').elements.namedItem('name') as HTMLInputElement;
    keep.value = fit.parameters.name;
    keep.classList.remove('invalid');
    for (const id of ['#calibrate-keep', '#calibrate-svg', '#calibrate-png', '#calibrate-params']) $<HTMLButtonElement>(this.doc, id).disabled = false;
    this.describeFit();
  }

  /** The summary and notes under the table; says so when the page no longer shows the fitted sheet. */
  private describeFit(): void {
    const fit = this.fit;
    const summary = $<HTMLElement>(this.doc, '#calibrate-summary');
    if (!fit) return;
    const s = fit.sheet;
    const shift = s.shiftUncertainty === null || Number.isNaN(s.shiftUncertainty) ? '' : `; shift ${s.shift.toFixed(3)} eV (reference ≈ model + shift)`;
    summary.replaceChildren(`${fit.sheetLabel} ← ${fit.referenceLabel}: rms ${fit.rms.toFixed(3)} eV, largest error ${fit.maxError.toFixed(3)} eV over ${fit.points} energies; reference bands ${s.referenceBands.join('–')} ↔ model bands ${s.modelBands.join('–')}${s.block === 'full' ? '' : ` of the ${s.block} block`}${shift}.`);
    if (fit.sheetLabel !== this.app.resolved.label) {
      const stale = this.doc.createElement('span');
      stale.className = 'calibrate-stale';
      stale.textContent = ` Fitted to ${fit.sheetLabel}; the page now shows ${this.app.resolved.label} — press “fit to this sheet” to fit the reference to it.`;
      summary.append(stale);
    }
    const fermi = s.fermi === null ? 'no E_F: equal weights' : `E_F ${s.fermi.toFixed(3)} eV (${s.fermiFrom === 'file' ? 'from the file' : 'estimated by the electron count'})`;
    const scan = fit.cutoffScan ? ` Cutoffs tried: ${fit.cutoffScan.map((c) => `${c.cutoff} Å (rms ${c.rms.toFixed(3)})`).join(', ')}.` : '';
    $<HTMLElement>(this.doc, '#calibrate-notes').textContent = `Best of ${fit.starts.length} starts: ${fit.start}. Weights ${fit.weights}; ${fermi}. d0 ${fit.parameters.d0} Å, cutoff ${fit.parameters.cutoff} Å.${scan} V_spσ is reported ≥ 0: bands do not fix its sign.${fit.converged ? '' : ' NOT CONVERGED: the iteration limit was reached.'}`;
  }

  // --- keeping and saving --------------------------------------------------------------------------------------

  /** The fitted set into the user's parameter sets (never replacing one kept before) and onto the page. */
  private keep(): void {
    const fit = this.fit;
    if (!fit) return;
    const input = $<HTMLFormElement>(this.doc, '#calibrate-keep-form').elements.namedItem('name') as HTMLInputElement;
    try {
      const name = keptName(input.value, this.app.library.parameterSets.map((p) => p.name));
      input.classList.remove('invalid');
      const set = { ...fit.parameters, name };
      this.app.library = { ...this.app.library, parameterSets: [...this.app.library.parameterSets, set] };
      this.app.saveLibrary();
      void this.app.edit({ params: { kind: 'own', set }, pick: undefined }, 'spectra').then(() => this.app.drawSheet());
      this.app.notices.show(`kept the fitted set as “${name}”: it is now the page's parameter set (Model panel, “yours: ${name}”)`, 'info');
    } catch (error) {
      if (!(error instanceof ValidationError)) throw error;
      input.classList.add('invalid');
      this.error(error.message, 'nothing was kept');
    }
  }

  private stem(): string {
    return (this.fit?.parameters.name ?? 'calibration').replace(/[^A-Za-z0-9_.-]+/g, '-').slice(0, 60);
  }

  private async saveFigure(kind: 'svg' | 'png'): Promise<void> {
    if (!this.fit) return;
    const svg = calibrationFigure(this.fit.figure, { document: this.doc, style: 'publication' });
    if (kind === 'svg') download(this.doc, `${this.stem()}.svg`, new Blob([svgText(svg)], { type: 'image/svg+xml' }));
    else download(this.doc, `${this.stem()}.png`, await svgToPng(svg));
  }

  private saveParameters(): void {
    if (!this.fit) return;
    download(this.doc, `${this.stem()}.json`, new Blob([`${JSON.stringify(this.fit.parameters, null, 2)}\n`], { type: 'application/json' }));
  }
}
