/**
 * The Metal panel: a metal (111) surface and the interface model's fields; for the current sheet the electrons per
 * atom the counting rule asks, the model's σ filling asks and the Fermi-level alignment gives (on the page's kept
 * mesh spectrum, no new diagonalisation), with "use this doping"; the sheet's coincidence fits on the metal; and
 * the η–δ map. All heavy work runs in the substrate worker, three lanes so that no job cancels another kind.
 */
import { etaDeltaFigure } from '../../figures/etaDelta.ts';
import type { EtaDeltaData } from '../../figures/types.ts';
import { ValidationError } from '../../io/invalid.ts';
import { cellMetrics } from '../../lattice/reducedCell.ts';
import { SHEET_PRESETS } from '../../lattice/presets.ts';
import type { Pattern } from '../../lattice/sheet.ts';
import type { AlignmentField } from '../../substrate/alignmentLimits.ts';
import { ALIGNMENT_DEFAULTS } from '../../substrate/defaults.ts';
import { findSubstrate, SUBSTRATES } from '../../substrate/substrates.ts';
import type { TransferResult } from '../../substrate/transfer.ts';
import type { App } from '../app.ts';
import { ALIGNMENT_FIELDS, METAL_FIELD_NAMES, readMetalFields } from '../metalFields.ts';
import { parameterSet, type MetalState } from '../state.ts';
import { Cancelled, WorkerLane } from '../worker/client.ts';
import type { FitsOutput } from '../worker/substrateWorker.ts';
import { drawFits } from './fitsTable.ts';

const $ = <T extends Element>(doc: Document, selector: string) => doc.querySelector<T>(selector)!;
const signed = (x: number, digits = 3) => `${x >= 0 ? '+' : '−'}${Math.abs(x).toFixed(digits)}`;

/** Mesh of the η–δ map: one mesh spectrum per candidate (the `metals` command's default). */
export const MAP_MESH = 24;
/** Most listed candidates placed on the map. */
export const MAP_MOST = 60;
/** Fits shown in the table. */
const FITS_SHOWN = 12;

export class MetalPanel {
  private readonly transferLane: WorkerLane;
  private readonly fitsLane: WorkerLane;
  private readonly mapLane: WorkerLane;
  /** The last transfer shown (for "use this doping"). */
  transfer: TransferResult | undefined;
  map: EtaDeltaData | undefined;
  private shownMetal: MetalState | undefined;
  private fitsKey = '';
  private mapKey = '';
  private transferKey: unknown[] = [];

  constructor(private readonly app: App, private readonly doc: Document, createWorker: () => Worker, private readonly listed: () => readonly { phase?: string; pattern: Pattern }[]) {
    this.transferLane = new WorkerLane(createWorker, 'alignment');
    this.fitsLane = new WorkerLane(createWorker, 'fits');
    this.mapLane = new WorkerLane(createWorker, 'map');
    const select = $<HTMLSelectElement>(doc, '#metal-select');
    select.replaceChildren(...SUBSTRATES.map((s) => {
      const option = doc.createElement('option');
      option.value = s.name;
      option.textContent = `${s.title} — W ${s.workFunction} eV`;
      return option;
    }));
    select.addEventListener('change', () => void app.edit({ metal: { ...app.state.metal, name: select.value } }, 'none'));
    const form = $<HTMLFormElement>(doc, '#metal-form');
    for (const field of ALIGNMENT_FIELDS) {
      const input = form.elements.namedItem(field) as HTMLInputElement;
      input.placeholder = String(ALIGNMENT_DEFAULTS[field].value);
      input.addEventListener('change', () => this.readFields(field));
    }
    $<HTMLButtonElement>(doc, '#metal-estimates').addEventListener('click', () => {
      for (const input of form.querySelectorAll('input')) input.value = '';
      this.readFields();
    });
    $<HTMLButtonElement>(doc, '#use-doping').addEventListener('click', () => {
      const given = this.transfer?.alignment.electronsPerAtom;
      // Rounded to 0.0001 e/atom: a readable doping field; the alignment itself is no better than that.
      if (given !== undefined) void app.edit({ doping: Number(given.toFixed(4)) }, 'fermi');
    });
    $<HTMLButtonElement>(doc, '#fits-cancel').addEventListener('click', () => this.fitsLane.cancel());
    $<HTMLButtonElement>(doc, '#map-cancel').addEventListener('click', () => this.mapLane.cancel());
    $<HTMLButtonElement>(doc, '#map-redraw').addEventListener('click', () => void this.computeMap(true));
    for (const radio of doc.querySelectorAll<HTMLInputElement>('input[name="map-source"]')) radio.addEventListener('change', () => void this.computeMap(true));
    app.onChange.push(() => this.refresh());
    app.onSpectra.push(() => void this.computeTransfer());
    this.refresh();
  }

  /** Reads the model fields: good ones into the view, bad ones named in a notice and outlined (their text kept). */
  private readFields(edited?: AlignmentField): void {
    const form = $<HTMLFormElement>(this.doc, '#metal-form');
    const input = (field: AlignmentField) => form.elements.namedItem(field) as HTMLInputElement;
    const texts = Object.fromEntries(ALIGNMENT_FIELDS.map((f) => [f, input(f).value])) as Record<AlignmentField, string>;
    const { model, errors } = readMetalFields(texts, this.app.state.metal.model, edited);
    for (const field of ALIGNMENT_FIELDS) input(field).classList.remove('invalid');
    $<HTMLElement>(this.doc, '#metal-error').textContent = errors.map((e) => e.message).join('; ');
    for (const error of errors) {
      this.app.notices.show(`${error.message} — the other fields are used; this one keeps its last good value`);
      const field = ALIGNMENT_FIELDS.find((f) => METAL_FIELD_NAMES[f] === error.field);
      if (field) input(field).classList.add('invalid');
    }
    if (JSON.stringify(model) === JSON.stringify(this.app.state.metal.model)) return;
    const metal = { ...this.app.state.metal, model };
    this.shownMetal = metal; // the fields already show it (and any refused text stays)
    void this.app.edit({ metal }, 'none');
  }

  private refresh(): void {
    const state = this.app.state.metal;
    if (state !== this.shownMetal) {
      this.shownMetal = state;
      $<HTMLSelectElement>(this.doc, '#metal-select').value = state.name;
      const form = $<HTMLFormElement>(this.doc, '#metal-form');
      for (const field of ALIGNMENT_FIELDS) {
        const input = form.elements.namedItem(field) as HTMLInputElement;
        input.value = state.model[field] === undefined ? '' : String(state.model[field]);
        input.classList.remove('invalid');
      }
    }
    this.drawSources(state.name);
    void this.computeTransfer();
    void this.computeFits();
    void this.computeMap(false);
  }

  /** The metal's numbers in one short line; every source, and the model's estimates, under "where these numbers come from". */
  private drawSources(name: string): void {
    const metal = findSubstrate(name)!;
    const height = metal.adsorptionHeight ? ` · a boron sheet sits about ${metal.adsorptionHeight.value} Å above it (estimate)` : '';
    $<HTMLElement>(this.doc, '#metal-source').textContent = `work function W_M = ${metal.workFunction} eV · surface spacing ${metal.nnDistance.toFixed(3)} Å${height}. The model's d is graphene's unless you set it.`;
    const item = (text: string) => {
      const li = this.doc.createElement('li');
      li.textContent = text;
      return li;
    };
    $<HTMLUListElement>(this.doc, '#metal-origins').replaceChildren(
      item(`${metal.title} work function: ${metal.workFunctionSource}`),
      item(`${metal.title} lattice constant ${metal.latticeConstant} Å: ${metal.latticeSource}`),
      item(metal.adsorptionHeight ? `height ${metal.adsorptionHeight.value} Å: ${metal.adsorptionHeight.source}` : `height: ${metal.adsorptionHeightNote ?? 'none known'}`),
      ...ALIGNMENT_FIELDS.map((field) => item(`${METAL_FIELD_NAMES[field]} = ${ALIGNMENT_DEFAULTS[field].value}: ${ALIGNMENT_DEFAULTS[field].origin}`)),
    );
  }

  // --- the three numbers -----------------------------------------------------------------------------------------

  private async computeTransfer(): Promise<void> {
    const spectra = this.app.spectra;
    const r = this.app.resolved;
    if (!spectra || spectra.sheetLabel !== r.label || spectra.atoms !== r.sheet.atoms.length) {
      this.status('waiting for the bands of this sheet…');
      $<HTMLTableSectionElement>(this.doc, '#metal-dopings tbody').replaceChildren();
      $<HTMLButtonElement>(this.doc, '#use-doping').disabled = true;
      return;
    }
    const key = [spectra.spectrum, spectra.smearing, this.app.state.metal, r.eta];
    if (key.every((k, i) => k === this.transferKey[i])) return;
    this.transferKey = key;
    try {
      this.transfer = await this.transferLane.run<TransferResult>('transfer', {
        spectrum: spectra.spectrum,
        metal: this.app.state.metal.name,
        holeDensity: r.eta,
        cellArea: cellMetrics(r.sheet.cell).area,
        smearing: spectra.smearing,
        model: this.app.state.metal.model,
      });
      this.drawTransfer();
    } catch (error) {
      this.failed(error, (message) => this.status(message));
    }
  }

  private status(text: string): void {
    $<HTMLElement>(this.doc, '#metal-status').textContent = text;
  }

  private drawTransfer(): void {
    const t = this.transfer!;
    const r = this.app.resolved;
    const a = t.alignment;
    const rows: [string, string, string, string?][] = [
      ['wants', 'counting rule asks', `${signed(t.countingRule.doping)} e/atom`, 'δ = 8/(3(1 − η)) − 3'],
      ['wants', 'model\u2019s σ filling asks', `${signed(t.sigmaFilling.doping)} e/atom`, `the doping that fills the tight-binding σ bonding states (${t.sigmaFilling.kind} at ${t.sigmaFilling.energy.toFixed(2)} eV)`],
      ['gives', `Fermi-level alignment with ${t.substrate.title} gives`, `${signed(a.electronsPerAtom, 4)} e/atom`, `E_F of the sheet rises by ${a.fermiShift.toFixed(3)} eV; W_S + Δc − W_M = ${a.drivingPotential.toFixed(2)} eV, of which ${a.capacitorStep.toFixed(3)} eV drops across the interface charge layer`],
      ['prefers', 'η the rule prefers at that doping', t.preferredHoleDensity.toFixed(4), `η* = (1 + 3δ)/(9 + 3δ); this sheet has η = ${r.eta.toFixed(4)}${r.etaEstimated ? ' (estimate)' : ''}`],
    ];
    const body = $<HTMLTableSectionElement>(this.doc, '#metal-dopings tbody');
    body.replaceChildren(...rows.map(([kind, name, value, title]) => {
      const row = this.doc.createElement('tr');
      row.className = kind;
      row.dataset.row = kind;
      const label = row.insertCell();
      label.textContent = name;
      const cell = row.insertCell();
      cell.className = 'num';
      cell.textContent = value;
      if (title) row.title = title;
      return row;
    }));
    const m = t.parameters;
    this.status(`${r.label} on ${t.substrate.title}: ${this.app.spectra!.parameters}, ${this.app.spectra!.mesh}×${this.app.spectra!.mesh} mesh, Gaussian width ${this.app.spectra!.smearing} eV; W_S ${m.sheetWorkFunction} eV, Δc ${m.dipole} eV, d ${m.distance} Å, d0 ${m.d0} Å.`);
    $<HTMLButtonElement>(this.doc, '#use-doping').disabled = false;
  }

  // --- fits ----------------------------------------------------------------------------------------------------

  private async computeFits(): Promise<void> {
    const r = this.app.resolved;
    const key = `${this.app.state.metal.name}|${JSON.stringify(r.sheet.cell)}|${r.sheet.atoms.length}`;
    if (key === this.fitsKey) return;
    this.fitsKey = key;
    const progress = $<HTMLElement>(this.doc, '#fits-progress');
    progress.hidden = false;
    const summary = $<HTMLElement>(this.doc, '#fits-summary');
    try {
      const output = await this.fitsLane.run<FitsOutput>('fits', { sheet: r.sheet, metal: this.app.state.metal.name, keep: FITS_SHOWN });
      drawFits(this.doc, $<HTMLTableSectionElement>(this.doc, '#metal-fits tbody'), output.fits);
      const metal = findSubstrate(this.app.state.metal.name)!;
      summary.textContent = output.found === 0
        ? `No supercell of this sheet up to 30 metal atoms fits ${metal.title} within 3 % strain.`
        : `${output.found} fit${output.found === 1 ? '' : 's'} up to 30 metal atoms and 3 % strain${output.found > FITS_SHOWN ? ` (the first ${FITS_SHOWN} shown)` : ''}, smallest cell first. A lattice match only, no energies.`;
    } catch (error) {
      this.failed(error, (message) => (summary.textContent = message));
      if (error instanceof Cancelled) {
        this.fitsKey = '';
        summary.textContent = 'fitting stopped';
      }
    } finally {
      if (!this.fitsLane.busy) progress.hidden = true;
    }
  }

  // --- the η–δ map ---------------------------------------------------------------------------------------------

  private mapPatterns(): { patterns: { name?: string; pattern: Pattern }[]; note: string } {
    const source = this.doc.querySelector<HTMLInputElement>('input[name="map-source"]:checked')?.value;
    if (source === 'listed') {
      const listed = this.listed();
      if (listed.length > 0) {
        const patterns = listed.slice(0, MAP_MOST).map((c) => (c.phase ? { name: c.phase, pattern: c.pattern } : { pattern: c.pattern }));
        return { patterns, note: listed.length > MAP_MOST ? `the first ${MAP_MOST} of ${listed.length} listed candidates` : `${listed.length} listed candidates` };
      }
      this.app.notices.show('no candidates are listed yet: the map shows the named sheets (list candidates in the Candidates panel first)', 'info');
    }
    return { patterns: SHEET_PRESETS.map((p) => ({ name: p.name, pattern: p.pattern })), note: 'the named sheets' };
  }

  private async computeMap(force: boolean): Promise<void> {
    const state = this.app.state;
    const { patterns, note } = this.mapPatterns();
    const current = { label: this.app.resolved.label, eta: this.app.resolved.eta };
    const key = JSON.stringify([patterns.map((p) => [p.name, p.pattern.vacancies, p.pattern.supercell]), state.params, state.smearing, state.metal.model]);
    if (key === this.mapKey && !force) {
      if (this.map) this.drawMap({ ...this.map, current });
      return;
    }
    this.mapKey = key;
    const progress = $<HTMLElement>(this.doc, '#map-progress');
    progress.hidden = false;
    progress.querySelector('span')!.textContent = `placing ${note}…`;
    try {
      this.map = await this.mapLane.run<EtaDeltaData>('map', {
        patterns, params: parameterSet(state.params), smearing: state.smearing, mesh: MAP_MESH, model: state.metal.model, current,
      }, (done, total) => {
        progress.querySelector('progress')!.value = total > 0 ? done / total : 0;
        progress.querySelector('span')!.textContent = `${done} / ${total} patterns`;
      });
      this.drawMap({ ...this.map, current: { label: this.app.resolved.label, eta: this.app.resolved.eta } });
    } catch (error) {
      if (error instanceof Cancelled) this.mapKey = '';
      this.failed(error, (message) => this.app.notices.show(`η–δ map: ${message}`));
    } finally {
      if (!this.mapLane.busy) progress.hidden = true;
    }
  }

  private drawMap(data: EtaDeltaData): void {
    this.map = data;
    $<HTMLElement>(this.doc, '#eta-delta-host').replaceChildren(etaDeltaFigure(data, { document: this.doc }));
  }

  private failed(error: unknown, show: (message: string) => void): void {
    if (error instanceof Cancelled) return;
    if (error instanceof ValidationError || error instanceof Error) show(error.message);
    else show(String(error));
  }
}
