/**
 * The sheet figure in the page: drawn by src/figures (the same code as `lacuna plot`), made interactive here —
 * zoom and pan, a click on a lattice site toggles a hole, the tips of the cell's arrows drag to lattice points,
 * hovering shows a site's coordinates and coordination.
 */
import { select, zoom, zoomIdentity, type ZoomBehavior, type ZoomTransform } from 'd3';
import { sheetFigure } from '../../figures/sheet.ts';
import type { SheetData } from '../../figures/types.ts';

export interface SheetViewEvents {
  toggleSite(i: number, j: number): void;
  moveCellVector(vector: 'A1' | 'A2', i: number, j: number): void;
}

const siteOf = (element: Element | null): [number, number] | undefined => {
  const text = element?.closest('[data-site]')?.getAttribute('data-site');
  if (!text) return undefined;
  const [i, j] = text.split(',').map(Number);
  return [i, j];
};

export class SheetView {
  private svg: SVGSVGElement | undefined;
  private transform: ZoomTransform = zoomIdentity;
  private behaviour: ZoomBehavior<SVGSVGElement, unknown> | undefined;
  private readonly tooltip: HTMLDivElement;

  constructor(private readonly host: HTMLElement, private readonly events: SheetViewEvents) {
    this.tooltip = host.ownerDocument.createElement('div');
    this.tooltip.className = 'tooltip';
    this.tooltip.hidden = true;
  }

  draw(data: SheetData): SVGSVGElement {
    const doc = this.host.ownerDocument;
    const width = Math.max(320, Math.min(720, this.host.clientWidth || 520));
    const svg = sheetFigure(data, { document: doc, style: 'screen', width, height: Math.round(width * 0.8) });
    this.host.replaceChildren(svg, this.tooltip);
    this.svg = svg;
    this.attach(svg, Boolean(data.pattern));
    return svg;
  }

  /** Back to the whole sheet in the frame. */
  fit(): void {
    if (this.svg && this.behaviour) select(this.svg).call(this.behaviour.transform, zoomIdentity);
  }

  private content(svg: SVGSVGElement): SVGGElement {
    return svg.querySelector<SVGGElement>('[data-layer="content"]')!;
  }

  private attach(svg: SVGSVGElement, editable: boolean): void {
    const content = this.content(svg);
    const behaviour = zoom<SVGSVGElement, unknown>()
      .scaleExtent([0.3, 12])
      .clickDistance(4)
      .filter((event: Event) => !(event.target as Element).closest?.('[data-handle]') && !(event as MouseEvent).button)
      .on('zoom', (event: { transform: ZoomTransform }) => {
        this.transform = event.transform;
        content.setAttribute('transform', event.transform.toString());
      });
    this.behaviour = behaviour;
    select(svg).call(behaviour).call(behaviour.transform, this.transform);

    svg.addEventListener('click', (event) => {
      const site = siteOf(event.target as Element);
      if (site && editable) this.events.toggleSite(site[0], site[1]);
    });
    svg.addEventListener('pointermove', (event) => this.hover(event));
    svg.addEventListener('pointerleave', () => (this.tooltip.hidden = true));
    if (editable) {
      for (const handle of svg.querySelectorAll<SVGElement>('[data-handle]')) this.dragHandle(svg, handle);
    }
  }

  private hover(event: PointerEvent): void {
    const target = event.target as Element;
    const siteElement = target.closest('[data-site]');
    if (!siteElement) {
      this.tooltip.hidden = true;
      return;
    }
    const coordination = siteElement.getAttribute('data-coordination');
    const vacant = siteElement.getAttribute('data-vacant') === 'true' || coordination === null;
    const text = `site (${siteElement.getAttribute('data-site')})${vacant ? ': hole' : `: atom, ${coordination} neighbours`}`;
    const box = this.host.getBoundingClientRect();
    this.tooltip.textContent = text;
    this.tooltip.style.left = `${event.clientX - box.left + 12}px`;
    this.tooltip.style.top = `${event.clientY - box.top + 12}px`;
    this.tooltip.hidden = false;
  }

  /** Nearest drawn lattice site to a client point, in the content's coordinates. */
  private nearestSite(svg: SVGSVGElement, clientX: number, clientY: number): [number, number] | undefined {
    const content = this.content(svg);
    const matrix = content.getScreenCTM();
    if (!matrix) return undefined;
    const point = new DOMPoint(clientX, clientY).matrixTransform(matrix.inverse());
    let best: [number, number] | undefined;
    let bestDistance = Infinity;
    for (const element of content.querySelectorAll<SVGGraphicsElement>('[data-site]')) {
      const box = element.getBBox();
      const dx = box.x + box.width / 2 - point.x;
      const dy = box.y + box.height / 2 - point.y;
      const distance = dx * dx + dy * dy;
      if (distance < bestDistance) {
        bestDistance = distance;
        best = siteOf(element);
      }
    }
    return best;
  }

  private dragHandle(svg: SVGSVGElement, handle: SVGElement): void {
    const vector = handle.getAttribute('data-handle') as 'A1' | 'A2';
    handle.style.cursor = 'grab';
    handle.addEventListener('pointerdown', (down) => {
      down.stopPropagation();
      down.preventDefault();
      handle.setPointerCapture(down.pointerId);
      let target: [number, number] | undefined;
      const move = (event: PointerEvent) => {
        target = this.nearestSite(svg, event.clientX, event.clientY);
        if (target) {
          this.tooltip.textContent = `${vector} → (${target[0]}, ${target[1]})`;
          const box = this.host.getBoundingClientRect();
          this.tooltip.style.left = `${event.clientX - box.left + 12}px`;
          this.tooltip.style.top = `${event.clientY - box.top + 12}px`;
          this.tooltip.hidden = false;
        }
      };
      const up = () => {
        handle.removeEventListener('pointermove', move);
        handle.removeEventListener('pointerup', up);
        this.tooltip.hidden = true;
        if (target) this.events.moveCellVector(vector, target[0], target[1]);
      };
      handle.addEventListener('pointermove', move);
      handle.addEventListener('pointerup', up);
    });
  }
}
