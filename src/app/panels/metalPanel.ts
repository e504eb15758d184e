/**
 * The Metal panel: a metal (111) surface and the interface model's fields; for the current sheet the electrons per
 * atom the counting rule asks, the model's σ filling asks and the Fermi-level alignment gives (on the page's kept
 * mesh spectrum, no new diagonalisation), with "use this doping"; the sheet's coincidence fits on the metal; and
 * the η–δ map (etaDeltaMap.ts). All heavy work runs in the substrate worker, three lanes so that no job cancels
 * another kind.
 */
import { ValidationError } from '../../validate/invalid.ts';
import { cellMetrics } from '../../lattice/reducedCell.ts';
import type { AlignmentField } from '../../substrate/alignmentLimits.ts';
import { ALIGNMENT_DEFAULTS } from '../../substrate/defaults.ts';
import { findSubstrate, SUBSTRATES } from '../../substrate/substrates.ts';
import type { TransferResult } from '../../substrate/transfer.ts';
import type { App } from '../app.ts';
import { ALIGNMENT_FIELDS, METAL_FIELD_NAMES, readMetalFields } from '../metalFields.ts';
import type { MetalState } from '../state.ts';
import { Cancelled, WorkerLane } from '../worker/client.ts';
import type { FitsOutput } from '../worker/substrateWorker.ts';
import { EtaDeltaMap, type Listed } from './etaDeltaMap.ts';
import { drawFits } from './fitsTable.ts';
import { labelledRow } from './tableRows.ts';

const $ = <T extends Element>(doc: Document, selector: string) => doc.querySelector<T>(selector)!;
const signed = (x: number, digits = 3) => `${x >= 0 ? '+' : '−'}${Math.abs(x).toFixed(digits)}`;

/** Fits shown in the table. */
const FITS_SHOWN = 12;

export class MetalPanel {
  private readonly transferLane: WorkerLane;
  private readonly fitsLane: WorkerLane;
  readonly etaDelta: EtaDeltaMap;
  /** The last transfer shown (for "use this doping"). */
  transfer: TransferResult | undefined;
  private shownMetal: MetalState | undefined;
  private fitsKey = '';
  private transferKey: unknown[] = [];
  private sourcesShown = '';
  /** What the panel's jobs depend on, as last seen (identity). */
  private deps: unknown[] = [];

  constructor(private readonly app: App, private readonly doc: Document, createWorker: () => Worker, listed: () => readonly Listed[]) {
    this.transferLane = new WorkerLane(createWorker, 'alignment');
    this.fitsLane = new WorkerLane(createWorker, 'fits');
    this.etaDelta = new EtaDeltaMap(app, doc, new WorkerLane(createWorker, 'map'), listed);
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
    // A doping edit (every slider frame) changes nothing the panel computes from: return at once.
    const a = this.app;
    const deps = [a.state.sheet, a.state.params, a.state.smearing, a.state.mesh, state, a.resolved];
    if (deps.every((d, i) => d === this.deps[i])) return;
    this.deps = deps;
    if (this.sourcesShown !== state.name) this.drawSources(state.name);
    void this.computeTransfer();
    void this.computeFits();
    void this.etaDelta.update(false);
  }

  /** The metal's numbers in one short line; every source, and the model's estimates, under "where these numbers come from". */
  private drawSources(name: string): void {
    this.sourcesShown = name;
    const metal = findSubstrate(name)!;
    const height = metal.adsorptionHeight ? ` · a boron sheet sits about ${metal.adsorptionHeight.value} Å above it (estimate)` : '';
    const source = metal.workFunctionSource.split(/[,;(]/)[0].trim();
    $<HTMLElement>(this.doc, '#metal-source').textContent = `work function W_M = ${metal.workFunction} eV (${source}${/from memory/.test(metal.workFunctionSource) ? ', from memory' : ''}) · surface spacing ${metal.nnDistance.toFixed(3)} Å${height}. The model's d is graphene's unless you set it.`;
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
      const row = labelledRow(this.doc, name, value, title);
      row.className = kind;
      row.dataset.row = kind;
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

  private failed(error: unknown, show: (message: string) => void): void {
    if (error instanceof Cancelled) return;
    if (error instanceof ValidationError || error instanceof Error) show(error.message);
    else show(String(error));
  }
}
