/**
 * The model controls: sheet and parameter-set pickers (the set's source shown), the editor of the user's own
 * set (validated field by field with the parameter-file parser), the doping slider, the Gaussian width, the
 * mesh and the supercell fields. Each field is validated on the way in; a refused value names its field and
 * leaves the view as it was.
 */
import { ValidationError, invalid } from '../../validate/invalid.ts';
import { validateParameterObject } from '../../tb/paramsCheck.ts';
import { hnfRows } from '../../lattice/pattern.ts';
import { SHEET_PRESETS } from '../../lattice/presets.ts';
import { PARAMETER_PRESETS, type ParameterSet } from '../../tb/params.ts';
import type { App } from '../app.ts';
import { LIMITS, parameterSet } from '../state.ts';

const $ = <T extends Element>(doc: Document, selector: string) => doc.querySelector<T>(selector)!;

/** A number field's value, or a field error naming it. */
export function readNumber(input: HTMLInputElement, field: string, low: number, high: number, open: [boolean, boolean] = [false, false]): number {
  const text = input.value.trim();
  const x = Number(text);
  if (text === '' || !Number.isFinite(x)) invalid(field, text, 'not a number');
  const ok = (open[0] ? x > low : x >= low) && (open[1] ? x < high : x <= high);
  if (!ok) invalid(field, text, `must lie in ${open[0] ? '(' : '['}${low}, ${high}${open[1] ? ')' : ']'}`);
  return x;
}

function option(doc: Document, value: string, text: string): HTMLOptionElement {
  const element = doc.createElement('option');
  element.value = value;
  element.textContent = text;
  return element;
}

export function wireControls(app: App, doc: Document): void {
  const sheetSelect = $<HTMLSelectElement>(doc, '#sheet-select');
  const paramsSelect = $<HTMLSelectElement>(doc, '#params-select');
  const source = $<HTMLElement>(doc, '#params-source');
  const dopingRange = $<HTMLInputElement>(doc, '#doping-range');
  const doping = $<HTMLInputElement>(doc, '#doping');
  const smearing = $<HTMLInputElement>(doc, '#smearing');
  const mesh = $<HTMLInputElement>(doc, '#mesh');
  const repeats = $<HTMLInputElement>(doc, '#repeats');
  const cell = ['#cell-a', '#cell-b', '#cell-c'].map((s) => $<HTMLInputElement>(doc, s));
  const form = $<HTMLFormElement>(doc, '#params-form');
  const formError = $<HTMLElement>(doc, '#params-error');

  const refuse = (error: unknown, input?: HTMLInputElement) => {
    if (!(error instanceof ValidationError)) throw error;
    app.notices.show(error.message);
    input?.classList.add('invalid');
    app.onChange.forEach((listener) => listener()); // put the field back to the state's value
  };

  const fillSheetSelect = () => {
    const state = app.state.sheet;
    sheetSelect.replaceChildren(
      ...SHEET_PRESETS.map((p) => option(doc, `preset:${p.name}`, `${p.name} — ${p.title}`)),
      ...app.library.sheets.map((s, index) => option(doc, `kept:${index}`, `kept: ${s.label}`)),
    );
    if (state.kind === 'preset') sheetSelect.value = `preset:${state.name}`;
    else {
      sheetSelect.append(option(doc, 'current', `${state.label} (this sheet)`));
      sheetSelect.value = 'current';
    }
  };
  const fillParamsSelect = () => {
    const choice = app.state.params;
    paramsSelect.replaceChildren(
      ...PARAMETER_PRESETS.map((p) => option(doc, `preset:${p.name}`, p.name)),
      ...app.library.parameterSets.map((p, index) => option(doc, `kept:${index}`, `yours: ${p.name}`)),
    );
    if (choice.kind === 'preset') paramsSelect.value = `preset:${choice.name}`;
    else {
      const index = app.library.parameterSets.findIndex((p) => JSON.stringify(p) === JSON.stringify(choice.set));
      if (index >= 0) paramsSelect.value = `kept:${index}`;
      else {
        paramsSelect.append(option(doc, 'current', `${choice.set.name} (from the link)`));
        paramsSelect.value = 'current';
      }
    }
    const set = parameterSet(choice);
    source.textContent = `${set.source}${set.provenance ? ` — ${set.provenance}` : ''}`;
  };
  const fillForm = (set: ParameterSet) => {
    const values: Record<string, string | number> = {
      name: set.name, source: set.source, 'onsite.s': set.onsite.s, 'onsite.p': set.onsite.p,
      'hopping.ss_sigma': set.hopping.ss_sigma, 'hopping.sp_sigma': set.hopping.sp_sigma,
      'hopping.pp_sigma': set.hopping.pp_sigma, 'hopping.pp_pi': set.hopping.pp_pi,
      d0: set.d0, exponent: set.exponent, cutoff: set.cutoff,
    };
    for (const [name, value] of Object.entries(values)) (form.elements.namedItem(name) as HTMLInputElement).value = String(value);
  };

  // The pickers are rebuilt only when what they list changed (not on every doping-slider frame).
  let pickersKey = '';
  const refresh = () => {
    const key = JSON.stringify([app.state.sheet.kind === 'preset' ? app.state.sheet.name : app.resolved.label, app.state.params, app.library]);
    if (key !== pickersKey) {
      pickersKey = key;
      fillSheetSelect();
      fillParamsSelect();
    }
    dopingRange.value = String(Math.max(-1, Math.min(2, app.state.doping)));
    if (doc.activeElement !== doping) doping.value = String(app.state.doping);
    smearing.value = String(app.state.smearing);
    mesh.value = app.state.mesh === undefined ? '' : String(app.state.mesh);
    mesh.placeholder = `auto: ${app.mesh().mesh}`;
    mesh.title = app.mesh().why;
    repeats.value = String(app.state.repeats);
    const pattern = app.resolved.pattern;
    const rows = pattern ? hnfRows(pattern.supercell) : undefined;
    cell.forEach((input, index) => {
      input.disabled = !pattern;
      input.value = rows ? String([rows[0][0], rows[1][0], rows[1][1]][index]) : '';
    });
    for (const input of doc.querySelectorAll('.controls input.invalid, .toolbar input.invalid')) input.classList.remove('invalid');
    ($<HTMLButtonElement>(doc, '#undo')).disabled = !app.history.canUndo;
    ($<HTMLButtonElement>(doc, '#redo')).disabled = !app.history.canRedo;
  };
  app.onChange.push(refresh);
  fillForm(parameterSet(app.state.params));
  refresh();

  sheetSelect.addEventListener('change', () => {
    const [kind, key] = sheetSelect.value.split(':');
    if (kind === 'preset') void app.edit({ sheet: { kind: 'preset', name: key }, pick: undefined }, 'spectra');
    else if (kind === 'kept') {
      const kept = app.library.sheets[Number(key)];
      const sheet = kept.pattern ? { kind: 'pattern' as const, label: kept.label, pattern: kept.pattern } : { kind: 'explicit' as const, label: kept.label, sheet: kept.sheet! };
      void app.edit({ sheet, pick: undefined }, 'spectra');
    }
  });
  paramsSelect.addEventListener('change', () => {
    const [kind, key] = paramsSelect.value.split(':');
    const choice = kind === 'preset' ? { kind: 'preset' as const, name: key } : { kind: 'own' as const, set: app.library.parameterSets[Number(key)] };
    fillForm(parameterSet(choice));
    void app.edit({ params: choice, pick: undefined }, 'spectra').then(() => app.drawSheet());
  });

  // The slider moves E_F live (no diagonalisation); the number field and the slider's release are recorded.
  dopingRange.addEventListener('input', () => {
    doping.value = dopingRange.value;
    void app.edit({ doping: Number(dopingRange.value) }, 'fermi', false);
  });
  let beforeSlide = app.state;
  dopingRange.addEventListener('pointerdown', () => (beforeSlide = app.state));
  dopingRange.addEventListener('change', () => {
    app.history.record({ ...beforeSlide });
    app.onChange.forEach((listener) => listener());
  });
  doping.addEventListener('change', () => {
    try {
      const value = readNumber(doping, 'doping δ', LIMITS.doping[0], LIMITS.doping[1], [true, true]);
      void app.edit({ doping: value }, 'fermi');
    } catch (error) {
      refuse(error, doping);
    }
  });
  smearing.addEventListener('change', () => {
    try {
      void app.edit({ smearing: readNumber(smearing, 'Gaussian width', 0, 10, [true, false]) }, 'width');
    } catch (error) {
      refuse(error, smearing);
    }
  });
  mesh.addEventListener('change', () => {
    try {
      // Empty: back to the CLI's rule (36 for cells up to 12 atoms, else one k-point density).
      const value = mesh.value.trim() === '' ? undefined : readNumber(mesh, 'k-mesh', LIMITS.mesh[0], LIMITS.mesh[1]);
      if (value !== undefined && !Number.isInteger(value)) invalid('k-mesh', mesh.value, 'not an integer');
      void app.edit({ mesh: value }, 'spectra');
    } catch (error) {
      refuse(error, mesh);
    }
  });
  repeats.addEventListener('change', () => {
    try {
      const value = readNumber(repeats, 'repeats', LIMITS.repeats[0], LIMITS.repeats[1]);
      if (!Number.isInteger(value)) invalid('repeats', repeats.value, 'not an integer');
      void app.edit({ repeats: value }, 'none').then(() => app.drawSheet());
    } catch (error) {
      refuse(error, repeats);
    }
  });
  for (const input of cell) {
    input.addEventListener('change', () => {
      try {
        const [a, b, c] = cell.map((field, index) => {
          const value = readNumber(field, `supercell ${'abc'[index]}`, index === 1 ? 0 : 1, LIMITS.sites[1]);
          if (!Number.isInteger(value)) invalid(`supercell ${'abc'[index]}`, field.value, 'not an integer');
          return value;
        });
        app.setSupercell([[a, 0], [b, c]]);
      } catch (error) {
        refuse(error, input);
      }
    });
  }

  // The user's own parameter set: every field through the parameter-file parser, the bad one outlined.
  form.addEventListener('submit', (event) => {
    event.preventDefault();
    for (const input of form.querySelectorAll('input')) input.classList.remove('invalid');
    formError.textContent = '';
    const value = (name: string) => (form.elements.namedItem(name) as HTMLInputElement).value.trim();
    const numberOf = (name: string) => (value(name) === '' ? value(name) : Number(value(name)));
    const candidate = {
      name: value('name'), source: value('source'),
      onsite: { s: numberOf('onsite.s'), p: numberOf('onsite.p') },
      hopping: { ss_sigma: numberOf('hopping.ss_sigma'), sp_sigma: numberOf('hopping.sp_sigma'), pp_sigma: numberOf('hopping.pp_sigma'), pp_pi: numberOf('hopping.pp_pi') },
      d0: numberOf('d0'), exponent: numberOf('exponent'), cutoff: numberOf('cutoff'),
    };
    try {
      if (PARAMETER_PRESETS.some((p) => p.name === candidate.name)) invalid('name', candidate.name, 'a preset has this name; choose another');
      const set = validateParameterObject(candidate);
      app.library = { ...app.library, parameterSets: app.library.parameterSets.filter((p) => p.name !== set.name).concat(set) };
      app.saveLibrary();
      void app.edit({ params: { kind: 'own', set }, pick: undefined }, 'spectra').then(() => app.drawSheet());
    } catch (error) {
      if (!(error instanceof ValidationError)) throw error;
      formError.textContent = error.message;
      (form.elements.namedItem(error.field) as HTMLInputElement | null)?.classList.add('invalid');
    }
  });
}
