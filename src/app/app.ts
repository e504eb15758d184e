/**
 * The page's controller: one view state, the figures drawn from it, and the jobs that compute them.
 *
 * Data flows one way: state → resolved sheet → (model worker) spectra → figures. Edits go through `edit`,
 * which records the state for undo, writes the URL hash and recomputes only what the edit touched:
 * the sheet, parameters or mesh → new spectra; the Gaussian width → new DOS and E_F from the kept spectrum;
 * the doping → E_F on the page's copy of the mesh spectrum (no diagonalisation).
 */
import { prepareSheet } from '../figures/prepare.ts';
import type { SelectedState, SheetData, SpectraData } from '../figures/types.ts';
import { ValidationError } from '../validate/invalid.ts';
import { hnfRows, makePattern } from '../lattice/pattern.ts';
import { countingRuleDoping } from '../tb/countingRule.ts';
import { FermiSolver } from '../tb/fermi.ts';
import { chooseMesh, type MeshChoice } from '../tb/meshDensity.ts';
import { observablesAt } from '../tb/fill.ts';
import type { SigmaBondingResult } from '../tb/sigmaBonding.ts';
import { EditHistory } from './history.ts';
import { loadLibrary, saveLibrary, type Library } from './library.ts';
import { drawCountBox } from './panels/countBox.ts';
import type { Notices } from './panels/notices.ts';
import { SheetView } from './panels/sheetView.ts';
import { nextTask, pathPlace, SpectrumView } from './panels/spectrumView.ts';
import { changeSupercell, resolveSheetChoice, toggleSite, type ResolvedSheet } from './sheetChoice.ts';
import { parameterSet, writeHash, type ViewState } from './state.ts';
import { Cancelled, WorkerLane } from './worker/client.ts';
import type { BondingInput, SpectraInput, SpectraOutput } from './worker/modelWorker.ts';
import { NO_SPECTRUM } from './worker/protocol.ts';

/** Points on the automatic path, as the CLI's default. */
export const PATH_POINTS = 300;

/** What one edit needs recomputed. */
export type Recompute = 'spectra' | 'width' | 'fermi' | 'sheet' | 'none';

export interface Elements {
  sheetHost: HTMLElement;
  bandsHost: HTMLElement;
  dosHost: HTMLElement;
  zoneHost: HTMLElement;
  countBox: HTMLElement;
  summary: HTMLElement;
  sheetReadout: HTMLElement;
  stateReadout: HTMLElement;
  progress: HTMLElement;
}

/** Timings the browser run prints (benchmarks, not assertions). */
export interface Timings {
  lastSpectraMs?: number;
  lastSpectraWorkerSeconds?: number;
  lastFermiFrameMs?: number;
  /** From a click that edits the sheet to its new bands drawn (ms). */
  lastEditToBandsMs?: number;
  firstFigureMs?: number;
}

export class App {
  state: ViewState;
  resolved: ResolvedSheet;
  spectra: SpectraData | undefined;
  bonding: SigmaBondingResult | undefined;
  selected: SelectedState | undefined;
  library: Library;
  readonly history = new EditHistory<ViewState>();
  readonly model: WorkerLane;
  /** A second model worker for the σ-bonding analysis, so it never holds up the bands or a picked state. */
  readonly analysis: WorkerLane;
  readonly sheetView: SheetView;
  readonly spectrumView: SpectrumView;
  readonly timings: Timings = {};
  /** Listeners told after every state change (controls refresh their fields). */
  readonly onChange: (() => void)[] = [];
  /** Listeners told when a new mesh spectrum (or a new Gaussian width on it) is in `spectra` (the Metal panel). */
  readonly onSpectra: (() => void)[] = [];
  energyWindow: { low?: number; high?: number } = {};
  private solver: FermiSolver | undefined;
  private editStarted: number | undefined;
  private pickWaiting = false;
  private readonly started = performance.now();

  constructor(
    initial: ViewState,
    private readonly elements: Elements,
    readonly notices: Notices,
    private readonly storage: Storage,
    createModelWorker: () => Worker,
  ) {
    this.state = initial;
    this.resolved = resolveSheetChoice(initial.sheet);
    const loaded = loadLibrary(storage);
    this.library = loaded.library;
    if (loaded.error) notices.show(`${loaded.error.message} — the stored library could not be read; it was kept under a backup key and an empty one is used`);
    this.model = new WorkerLane(createModelWorker, 'model');
    this.analysis = new WorkerLane(createModelWorker, 'analysis');
    this.sheetView = new SheetView(elements.sheetHost, {
      toggleSite: (i, j) => this.editPattern((pattern) => toggleSite(pattern, i, j)),
      moveCellVector: (vector, i, j) => this.moveCellVector(vector, i, j),
    });
    this.spectrumView = new SpectrumView(
      { bands: elements.bandsHost, dos: elements.dosHost, zone: elements.zoneHost },
      { pick: (kIndex, band) => this.edit({ pick: { kIndex, band } }, 'none', false).then(() => this.loadState()) },
    );
  }

  /** Draws everything for the current state. */
  async start(): Promise<void> {
    // One task each (the first, cold run of the figure code is the slowest): the sheet, then the rest.
    await nextTask();
    this.drawSheet();
    await nextTask();
    this.changed();
    await this.computeSpectra();
  }

  saveLibrary(): void {
    saveLibrary(this.storage, this.library);
  }

  /**
   * Applies a change to the view: records the old state for undo (when `record`), writes the hash, and
   * recomputes what the change needs.
   */
  async edit(change: Partial<ViewState>, recompute: Recompute, record = true): Promise<void> {
    if (record) this.history.record(this.state);
    this.state = { ...this.state, ...change };
    await this.apply(recompute);
  }

  /** Replaces the whole state (undo, redo, a new hash) and recomputes everything. */
  async replace(state: ViewState): Promise<void> {
    this.state = state;
    await this.apply('spectra');
  }

  private async apply(recompute: Recompute): Promise<void> {
    if (recompute === 'spectra' || recompute === 'sheet') {
      this.resolved = resolveSheetChoice(this.state.sheet);
      this.selected = undefined;
      this.drawSheet();
    }
    this.changed();
    if (recompute === 'spectra') await this.computeSpectra();
    else if (recompute === 'width') await this.computeWidth();
    else if (recompute === 'fermi') this.moveFermi();
  }

  private changed(): void {
    history.replaceState(null, '', writeHash(this.state));
    this.drawSummary();
    for (const listener of this.onChange) listener();
  }

  undo(): void {
    const previous = this.history.undo(this.state);
    if (previous) void this.replace(previous);
  }

  redo(): void {
    const next = this.history.redo(this.state);
    if (next) void this.replace(next);
  }

  // --- sheet edits ---------------------------------------------------------------------------------------------

  private editPattern(change: (pattern: NonNullable<ResolvedSheet['pattern']>) => NonNullable<ResolvedSheet['pattern']>): void {
    const pattern = this.resolved.pattern;
    this.editStarted = performance.now();
    if (!pattern) {
      this.notices.show('this sheet is not a vacancy pattern of the triangular lattice, so its sites cannot be toggled');
      return;
    }
    try {
      const next = change(pattern);
      const label = this.resolved.label.endsWith('(edited)') ? this.resolved.label : `${this.resolved.label} (edited)`;
      void this.edit({ sheet: { kind: 'pattern', label, pattern: next }, pick: undefined }, 'spectra');
    } catch (error) {
      if (error instanceof ValidationError) this.notices.show(error.message);
      else throw error;
    }
  }

  setSupercell(rows: [[number, number], [number, number]]): void {
    const pattern = this.resolved.pattern;
    if (!pattern) return;
    try {
      const { pattern: next, kept } = changeSupercell(pattern, rows);
      if (!kept) this.notices.show('the pattern does not repeat in that cell: the holes that fall inside it were kept (undo brings the old cell back)', 'info');
      const label = this.resolved.label.endsWith('(edited)') ? this.resolved.label : `${this.resolved.label} (edited)`;
      void this.edit({ sheet: { kind: 'pattern', label, pattern: next }, pick: undefined }, 'spectra');
    } catch (error) {
      if (error instanceof ValidationError) this.notices.show(error.message);
      else throw error;
    }
  }

  private moveCellVector(vector: 'A1' | 'A2', i: number, j: number): void {
    const pattern = this.resolved.pattern;
    if (!pattern) return;
    const rows = hnfRows(pattern.supercell);
    if (vector === 'A1') rows[0] = [i, j];
    else rows[1] = [i, j];
    this.setSupercell(rows);
  }

  /** A pattern as the new sheet (from the candidates, the library, an import). */
  showPattern(label: string, pattern: Parameters<typeof makePattern>[0]): void {
    void this.edit({ sheet: { kind: 'pattern', label, pattern: makePattern(pattern) }, pick: undefined }, 'spectra');
  }

  // --- drawing -------------------------------------------------------------------------------------------------

  sheetData(): SheetData {
    const params = parameterSet(this.state.params);
    return prepareSheet(
      { label: this.resolved.label, sheet: this.resolved.sheet, pattern: this.resolved.pattern },
      { bondCutoff: params.cutoff, repeats: [this.state.repeats, this.state.repeats], state: this.selected },
    );
  }

  drawSheet(): void {
    this.sheetView.draw(this.sheetData());
    const r = this.resolved;
    const cell = r.pattern ? `edited cell ${r.pattern.supercell.a * r.pattern.supercell.c} sites; smallest cell ${r.cellPattern!.supercell.a * r.cellPattern!.supercell.c} sites, ${r.sheet.atoms.length} atoms` : `${r.sheet.atoms.length} atoms per cell (not on a triangular lattice: sites cannot be toggled)`;
    this.elements.sheetReadout.textContent = cell;
  }

  private drawSummary(): void {
    const r = this.resolved;
    const rule = countingRuleDoping(r.eta);
    const doc = this.elements.summary.ownerDocument;
    const name = doc.createElement('b');
    name.textContent = r.label;
    this.elements.summary.replaceChildren(
      name,
      ` · η = ${r.eta.toFixed(4)}${r.etaEstimated ? ' (estimate)' : ''} · counting rule asks δ = ${rule >= 0 ? '+' : '−'}${Math.abs(rule).toFixed(3)} e/atom · parameters ${parameterSet(this.state.params).name}`,
    );
  }

  private drawCounts(): void {
    const r = this.resolved;
    const spectra = this.spectra;
    const ruleDoping = countingRuleDoping(r.eta);
    let fermi: number | undefined;
    let sigma: number | undefined;
    let pi: number | undefined;
    let bandEnergy: number | undefined;
    let ruleEnergy: number | undefined;
    if (spectra && this.solver) {
      fermi = spectra.fermi;
      const observed = observablesAt(spectra.spectrum, fermi, this.state.smearing);
      sigma = observed.sigma;
      pi = observed.pi;
      bandEnergy = observed.bandEnergy;
      ruleEnergy = this.ruleEnergy();
    }
    drawCountBox(this.elements.countBox, {
      eta: r.eta,
      etaEstimated: r.etaEstimated,
      atoms: r.sheet.atoms.length,
      holesPerSites: r.pattern ? [r.pattern.vacancies.length, r.pattern.supercell.a * r.pattern.supercell.c] : undefined,
      ruleDoping,
      ruleEnergy,
      bonding: this.bonding,
      doping: this.state.doping,
      fermi,
      sigma,
      pi,
      bandEnergy,
      parameters: parameterSet(this.state.params).name,
      mesh: this.mesh().why,
      smearing: this.state.smearing,
    });
  }

  /** The mesh of the spectra: the user's, or the CLI's rule for this cell (meshDensity.ts). */
  mesh(): MeshChoice {
    return chooseMesh(this.resolved.sheet, { mesh: this.state.mesh });
  }

  /** E_F at the counting rule's doping, when that doping is a legal count (3 + δ in (0, 8)). */
  ruleEnergy(): number | undefined {
    const doping = countingRuleDoping(this.resolved.eta);
    if (!this.solver || !(3 + doping > 0 && 3 + doping < 8)) return undefined;
    return this.solver.solve(3 + doping, this.state.smearing).fermi;
  }

  private async drawSpectra(): Promise<void> {
    const spectra = this.spectra;
    if (!spectra) return;
    const range = SpectrumView.energyRange(spectra, this.energyWindow.low, this.energyWindow.high);
    const drawn = this.spectrumView.draw(spectra, { energyRange: range, selected: this.state.pick && this.selected ? this.state.pick : undefined, ruleEnergy: this.ruleEnergy() });
    // The bands are on the page now (the DOS and zone follow in the next tasks).
    this.timings.firstFigureMs ??= performance.now() - this.started;
    if (this.editStarted !== undefined) {
      this.timings.lastEditToBandsMs = performance.now() - this.editStarted;
      this.editStarted = undefined;
    }
    if (!(await drawn)) return;
    this.drawCounts();
  }

  /** Redraws the figures at a new energy window. */
  setEnergyWindow(low?: number, high?: number): void {
    this.energyWindow = { low, high };
    void this.drawSpectra();
  }

  // --- jobs ----------------------------------------------------------------------------------------------------

  private progress(done: number, total: number, what: string): void {
    const box = this.elements.progress;
    box.hidden = false;
    box.querySelector('progress')!.value = total > 0 ? done / total : 0;
    box.querySelector('span')!.textContent = `${done} / ${total} ${what}`;
  }

  async computeSpectra(): Promise<void> {
    const params = parameterSet(this.state.params);
    const input: SpectraInput = {
      label: this.resolved.label,
      sheet: this.resolved.sheet,
      params,
      doping: this.state.doping,
      smearing: this.state.smearing,
      mesh: this.mesh().mesh,
      pathPoints: PATH_POINTS,
    };
    const started = performance.now();
    try {
      const output = await this.model.run<SpectraOutput>('spectra', input, (done, total, what) => this.progress(done, total, what));
      this.elements.progress.hidden = true;
      this.timings.lastSpectraMs = performance.now() - started;
      this.spectra = output.data;
      this.bonding = undefined;
      this.solver = new FermiSolver(output.data.spectrum);
      await this.drawSpectra();
      for (const listener of this.onSpectra) listener();
      this.pickWaiting = false;
      if (this.state.pick) await this.loadState();
      await this.computeBonding();
    } catch (error) {
      this.jobFailed(error);
    }
  }

  /** The σ-bonding analysis of the kept spectrum, after the figures (it is the slowest part and draws nothing). */
  private async computeBonding(): Promise<void> {
    if (!this.spectra) return;
    const input: BondingInput = {
      sheet: this.resolved.sheet, params: parameterSet(this.state.params), spectrum: this.spectra.spectrum,
      eta: this.resolved.eta, etaEstimated: this.resolved.etaEstimated, smearing: this.state.smearing,
    };
    try {
      this.bonding = await this.analysis.run<SigmaBondingResult>('bonding', input);
      this.drawCounts();
    } catch (error) {
      this.jobFailed(error);
    }
  }

  private async computeWidth(): Promise<void> {
    const spectra = this.spectra;
    if (!spectra) return this.computeSpectra();
    try {
      const output = await this.model.run<{ dos: SpectraData['dos']; fermi: number }>('width', {
        smearing: this.state.smearing, doping: this.state.doping,
      });
      this.spectra = { ...spectra, dos: output.dos, fermi: output.fermi, smearing: this.state.smearing };
      this.bonding = undefined;
      await this.drawSpectra();
      for (const listener of this.onSpectra) listener();
      if (this.pickWaiting) {
        this.pickWaiting = false;
        await this.loadState();
      }
      await this.computeBonding();
    } catch (error) {
      if (error instanceof Error && error.message === NO_SPECTRUM) return this.computeSpectra();
      this.jobFailed(error);
    }
  }

  /** A doping-slider frame: E_F from the kept spectrum, moved on the drawn figures. */
  moveFermi(): void {
    const spectra = this.spectra;
    if (!spectra || !this.solver) return;
    const started = performance.now();
    const fermi = this.solver.solve(3 + this.state.doping, this.state.smearing).fermi;
    this.spectra = { ...spectra, fermi, doping: this.state.doping };
    this.spectrumView.setFermi(fermi);
    this.drawCounts();
    this.timings.lastFermiFrameMs = performance.now() - started;
  }

  /** The picked Bloch state, drawn on the sheet and the zone. */
  async loadState(): Promise<void> {
    const pick = this.state.pick;
    const spectra = this.spectra;
    if (!pick || !spectra) return;
    // One job at a time on the model worker (a new one would end the running one and the spectrum it keeps):
    // a pick made meanwhile is loaded when that job is done.
    if (this.model.busy) {
      this.pickWaiting = true;
      return;
    }
    if (!(pick.kIndex < spectra.path.count && pick.band < spectra.path.bands)) {
      this.notices.show(`invalid pick: "${pick.kIndex},${pick.band}" (the path has ${spectra.path.count} points and ${spectra.path.bands} bands)`);
      this.state = { ...this.state, pick: undefined };
      this.changed();
      return;
    }
    const k: [number, number] = [spectra.path.kpoints[2 * pick.kIndex], spectra.path.kpoints[2 * pick.kIndex + 1]];
    try {
      this.selected = await this.model.run<SelectedState>('state', {
        sheet: this.resolved.sheet, params: parameterSet(this.state.params), kIndex: pick.kIndex, band: pick.band,
      });
      this.drawSheet();
      await this.drawSpectra();
      const relative = this.selected.energy - spectra.fermi;
      this.elements.stateReadout.textContent = `State at ${pathPlace(spectra.path.labels, pick.kIndex)} (k = ${k[0].toFixed(3)}, ${k[1].toFixed(3)} Å⁻¹), band ${pick.band + 1}: E − E_F = ${relative >= 0 ? '+' : '−'}${Math.abs(relative).toFixed(3)} eV, σ share ${(100 * this.selected.sigma).toFixed(0)}%. Disc area on the sheet: weight on each atom; colour: phase.`;
    } catch (error) {
      this.jobFailed(error);
    }
    // A pick made while this one was computed.
    if (this.pickWaiting && (this.state.pick?.kIndex !== pick.kIndex || this.state.pick?.band !== pick.band)) {
      this.pickWaiting = false;
      await this.loadState();
    }
    this.pickWaiting = false;
  }

  private jobFailed(error: unknown): void {
    if (error instanceof Cancelled) return;
    this.elements.progress.hidden = true;
    this.notices.show(error instanceof Error ? error.message : String(error));
  }
}
