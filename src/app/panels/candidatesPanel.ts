/**
 * The candidates browser over the enumerator: a search form (sites, holes, η window, isolated holes, a measured
 * cell with tolerance), the list in a table sortable four ways, band energies on demand (one k-point density for
 * all), and a click that loads a candidate into the sheet and the bands. Heavy work runs in the search worker,
 * with progress and a stop button.
 */
import { ValidationError, invalid } from '../../validate/invalid.ts';
import { hnfRows } from '../../lattice/pattern.ts';
import type { App } from '../app.ts';
import { candidateName, sortCandidates, type Candidate, type CandidateList, type CandidateOrder } from '../candidates.ts';
import { LIMITS, parameterSet, type SearchState } from '../state.ts';
import { Cancelled, WorkerLane } from '../worker/client.ts';

const $ = <T extends Element>(doc: Document, selector: string) => doc.querySelector<T>(selector)!;

/** Bond length (Å) at which candidate cells are compared with a measured one: the current sheet's, else 1.69. */
function searchBond(app: App): number {
  return app.resolved.pattern?.bond ?? 1.69;
}

function range(text: string, field: string, integer: boolean, low: number, high: number): [number, number] {
  const match = /^\s*([^-\s]+)\s*(?:-\s*([^-\s]+)\s*)?$/.exec(text);
  if (!match) invalid(field, text, 'not a range such as 1-12 or 6');
  const parse = (part: string) => {
    const x = Number(part);
    if (!Number.isFinite(x) || (integer && !Number.isInteger(x))) invalid(field, text, integer ? 'not whole numbers' : 'not numbers');
    if (!(x >= low && x <= high)) invalid(field, text, `must lie in [${low}, ${high}]`);
    return x;
  };
  const pair: [number, number] = [parse(match[1]), parse(match[2] ?? match[1])];
  if (pair[0] > pair[1]) invalid(field, text, 'the range is empty (low end above high end)');
  return pair;
}

function numbers(text: string, field: string, count: number): number[] {
  const parts = text.split(',').map((p) => p.trim());
  if (parts.length !== count || parts.some((p) => p === '' || !Number.isFinite(Number(p)))) invalid(field, text, `needs ${count} comma-separated numbers`);
  return parts.map(Number);
}

/** The search form as a SearchState, or the first bad field. */
export function readSearchForm(form: HTMLFormElement): SearchState {
  const value = (name: string) => (form.elements.namedItem(name) as HTMLInputElement).value.trim();
  const search: SearchState = {
    sites: range(value('sites') || '1-12', 'sites', true, LIMITS.sites[0], LIMITS.sites[1]),
    holes: range(value('holes') || '1-3', 'holes', true, 0, LIMITS.sites[1]),
    isolated: (form.elements.namedItem('isolated') as HTMLInputElement).checked,
  };
  if (value('eta') !== '') search.eta = range(value('eta'), 'η', false, 0, 1);
  if (value('cell') !== '') {
    const [a, b, gamma] = numbers(value('cell'), 'measured cell', 3);
    if (!(a > 0 && b > 0)) invalid('measured cell', value('cell'), 'lengths must be positive');
    if (!(gamma > 0 && gamma < 180)) invalid('measured cell', value('cell'), 'γ must lie strictly between 0° and 180°');
    const [lengthTolerance, angleTolerance] = value('tolerance') !== '' ? numbers(value('tolerance'), 'tolerance', 2) : [0.15, 3];
    if (!(lengthTolerance >= 0 && angleTolerance >= 0)) invalid('tolerance', value('tolerance'), 'must not be negative');
    search.cell = { a, b, gamma, lengthTolerance, angleTolerance };
  } else if (value('tolerance') !== '') {
    invalid('tolerance', value('tolerance'), 'only with a measured cell');
  }
  return search;
}

export class CandidatesPanel {
  private list: CandidateList | undefined;
  private order: CandidateOrder = 'eta';
  private selectedKey: string | undefined;
  private readonly lane: WorkerLane;

  constructor(private readonly app: App, private readonly doc: Document, createWorker: () => Worker) {
    this.lane = new WorkerLane(createWorker, 'search');
    const form = $<HTMLFormElement>(doc, '#search-form');
    this.fillForm(app.state.search);
    $<HTMLElement>(doc, '#candidates-summary').textContent = 'Give a range of cell sizes and hole counts (and, if you have one, the cell you measured), then press list.';
    form.addEventListener('submit', (event) => {
      event.preventDefault();
      void this.search();
    });
    $<HTMLButtonElement>(doc, '#rank-button').addEventListener('click', () => void this.rank());
    $<HTMLButtonElement>(doc, '#search-cancel').addEventListener('click', () => this.lane.cancel());
    for (const radio of doc.querySelectorAll<HTMLInputElement>('input[name="order"]')) {
      radio.addEventListener('change', () => {
        this.order = radio.value as CandidateOrder;
        this.drawTable();
      });
    }
  }

  /** The candidates listed now (empty before the first search). */
  get listed(): readonly Candidate[] {
    return this.list?.candidates ?? [];
  }

  fillForm(search: SearchState): void {
    const form = $<HTMLFormElement>(this.doc, '#search-form');
    const set = (name: string, value: string) => ((form.elements.namedItem(name) as HTMLInputElement).value = value);
    set('sites', search.sites.join('-'));
    set('holes', search.holes.join('-'));
    set('eta', search.eta ? search.eta.join('-') : '');
    (form.elements.namedItem('isolated') as HTMLInputElement).checked = search.isolated;
    set('cell', search.cell ? [search.cell.a, search.cell.b, search.cell.gamma].join(',') : '');
    set('tolerance', search.cell ? `${search.cell.lengthTolerance},${search.cell.angleTolerance}` : '');
  }

  private busy(on: boolean, what = ''): void {
    $<HTMLButtonElement>(this.doc, '#search-cancel').hidden = !on;
    const progress = $<HTMLElement>(this.doc, '#search-progress');
    progress.hidden = !on;
    progress.querySelector('span')!.textContent = what;
  }

  private onProgress = (done: number, total: number, what: string) => {
    const progress = $<HTMLElement>(this.doc, '#search-progress');
    progress.querySelector('progress')!.value = total > 0 ? done / total : 0;
    progress.querySelector('span')!.textContent = what === 'patterns' ? `${done} / ${total} patterns` : `${Math.round((100 * done) / total)}%`;
  };

  async search(): Promise<void> {
    const error = $<HTMLElement>(this.doc, '#search-error');
    error.textContent = '';
    let search: SearchState;
    try {
      search = readSearchForm($<HTMLFormElement>(this.doc, '#search-form'));
    } catch (failure) {
      if (!(failure instanceof ValidationError)) throw failure;
      error.textContent = failure.message;
      return;
    }
    await this.app.edit({ search }, 'none');
    this.busy(true, 'listing…');
    try {
      this.list = await this.lane.run<CandidateList>('candidates', { search, bond: searchBond(this.app) }, this.onProgress);
      this.drawTable();
    } catch (failure) {
      if (!(failure instanceof Cancelled)) error.textContent = failure instanceof Error ? failure.message : String(failure);
    } finally {
      this.busy(false);
    }
  }

  async rank(): Promise<void> {
    const list = this.list;
    if (!list || list.candidates.length === 0) {
      $<HTMLElement>(this.doc, '#search-error').textContent = 'list candidates first';
      return;
    }
    this.busy(true, 'band energies…');
    try {
      const results = await this.lane.run<{ bandEnergy: number; mesh: number }[]>('rank', {
        patterns: list.candidates.map((c) => c.pattern),
        params: parameterSet(this.app.state.params),
        doping: this.app.state.doping,
        smearing: this.app.state.smearing,
      }, this.onProgress);
      list.candidates.forEach((c, index) => {
        c.bandEnergy = results[index].bandEnergy;
        c.mesh = results[index].mesh;
      });
      const lowest = new Map<number, number>();
      for (const c of list.candidates) lowest.set(c.eta, Math.min(lowest.get(c.eta) ?? Infinity, c.bandEnergy!));
      for (const c of list.candidates) c.aboveLowest = c.bandEnergy! - lowest.get(c.eta)!;
      this.order = 'band';
      this.doc.querySelector<HTMLInputElement>('input[name="order"][value="band"]')!.checked = true;
      this.drawTable();
    } catch (failure) {
      if (!(failure instanceof Cancelled)) $<HTMLElement>(this.doc, '#search-error').textContent = failure instanceof Error ? failure.message : String(failure);
    } finally {
      this.busy(false);
    }
  }

  private drawTable(): void {
    const list = this.list;
    const body = $<HTMLTableSectionElement>(this.doc, '#candidates tbody');
    const summary = $<HTMLElement>(this.doc, '#candidates-summary');
    if (!list) return;
    const ranked = list.candidates.some((c) => c.bandEnergy !== undefined);
    summary.textContent = list.matched === 0
      ? 'No pattern in this range matches: widen the sites or holes, the tolerance, or drop the η window.'
      : `${list.matched} pattern${list.matched === 1 ? '' : 's'}${list.truncated ? ` (the first ${list.candidates.length} shown: narrow the search)` : ''}.${ranked ? ' Band energies: tight-binding estimate at one k-point density for all, compared within equal η only.' : ''} Click a row to load it.`;
    const rows = sortCandidates(list.candidates, this.order).map((candidate) => this.row(candidate));
    body.replaceChildren(...rows);
  }

  private row(candidate: Candidate): HTMLTableRowElement {
    const row = this.doc.createElement('tr');
    const key = `${JSON.stringify(hnfRows(candidate.pattern.supercell))}${JSON.stringify(candidate.pattern.vacancies)}`;
    row.dataset.key = key;
    row.setAttribute('aria-selected', String(key === this.selectedKey));
    const l = candidate.lattice;
    const cells = [
      candidate.phase ?? candidateName(candidate).split(' ')[0],
      String(candidate.sites),
      String(candidate.holes),
      candidate.eta.toFixed(4),
      `${l.a.toFixed(2)} × ${l.b.toFixed(2)} Å, ${l.gammaDeg.toFixed(1)}°`,
      `${candidate.ruleDoping >= 0 ? '+' : '−'}${Math.abs(candidate.ruleDoping).toFixed(3)}`,
      candidate.aboveLowest !== undefined ? candidate.aboveLowest.toFixed(4) : '—',
    ];
    for (const text of cells) {
      const cell = row.insertCell();
      cell.textContent = text;
    }
    row.title = `${candidateName(candidate)}${candidate.mesh ? ` · band energy on a ${candidate.mesh}×${candidate.mesh} mesh` : ''}`;
    row.addEventListener('click', () => {
      this.selectedKey = key;
      for (const other of row.parentElement!.children) other.setAttribute('aria-selected', String(other === row));
      const label = candidate.phase ?? candidateName(candidate).split(' ')[0];
      this.app.showPattern(label, { bond: candidate.pattern.bond, supercell: hnfRows(candidate.pattern.supercell), vacancies: candidate.pattern.vacancies });
    });
    return row;
  }
}
