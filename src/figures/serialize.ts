/**
 * SVG text of a figure, the same in a browser and headless: our own small XML writer (attributes in document
 * order, `xmlns` on the root), so a file written by the CLI and an export from the page are byte-identical for
 * the same figure (attributes sorted by name, since DOMs differ in their order). serializeFigure also rounds numbers and renumbers ids, for golden files.
 */
import { SVG_NS } from './frame.ts';

const escapeText = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
const escapeAttribute = (s: string) => escapeText(s).replace(/"/g, '&quot;');

type Rewrite = (name: string, value: string) => string;

/** Appends the XML of `node`; `attribute` rewrites attribute values, and text content under the name '#text'. */
function write(node: Node, out: string[], attribute: Rewrite, depth: number, pretty: boolean): void {
  if (node.nodeType === 3) {
    out.push(escapeText(attribute('#text', node.nodeValue ?? '')));
    return;
  }
  if (node.nodeType !== 1) return;
  const element = node as Element;
  const name = element.localName;
  let text = `<${name}`;
  if (depth === 0) text += ` xmlns="${SVG_NS}"`;
  // Sorted by name: DOM implementations list attributes in different orders (linkedom: newest first).
  const attributes = Array.from(element.attributes, (a) => [a.name, a.value]).filter(([n]) => n !== 'xmlns').sort((p, q) => (p[0] < q[0] ? -1 : p[0] > q[0] ? 1 : 0));
  for (const [n, value] of attributes) text += ` ${n}="${escapeAttribute(attribute(n, value))}"`;
  const children = element.childNodes;
  const indent = pretty ? `\n${'  '.repeat(depth)}` : '';
  if (children.length === 0) {
    out.push(`${depth > 0 ? indent : ''}${text}/>`);
    return;
  }
  out.push(`${depth > 0 ? indent : ''}${text}>`);
  let elements = false;
  for (let i = 0; i < children.length; i++) {
    if (children[i].nodeType === 1) elements = true;
    write(children[i], out, attribute, depth + 1, pretty);
  }
  out.push(`${elements && pretty ? `\n${'  '.repeat(depth)}` : ''}</${name}>`);
}

/** The figure as a standalone SVG file (XML declaration, namespace, full precision). */
export function svgText(svg: Element): string {
  const out: string[] = ['<?xml version="1.0" encoding="UTF-8"?>\n'];
  write(svg, out, (_, value) => value, 0, false);
  out.push('\n');
  return out.join('');
}

/** Attributes whose digits are not numbers (colours, fonts). */
const KEEP = new Set(['fill', 'stroke', 'stop-color', 'font-family']);

const NUMBER = /-?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?/gi;

/**
 * The figure with every number rounded to `digits` decimals and ids renumbered in document order (f1, f2, …,
 * references included), one element per line: stable text for golden-file tests.
 */
export function serializeFigure(svg: Element, digits = 2): string {
  const ids = new Map<string, string>();
  svg.querySelectorAll('[id]').forEach((element) => ids.set(element.getAttribute('id')!, `f${ids.size + 1}`));
  const round = (text: string) => text.replace(NUMBER, (n) => {
    const v = Number(n);
    if (!Number.isFinite(v)) return n;
    const r = Number(v.toFixed(digits));
    return String(r === 0 ? 0 : r);
  });
  const attribute = (name: string, value: string) => {
    if (name === 'id') return ids.get(value) ?? value;
    if (value.includes('#')) return value.replace(/#([\w-]+)/g, (whole, id: string) => (ids.has(id) ? `#${ids.get(id)}` : whole));
    return KEEP.has(name) ? value : round(value);
  };
  const out: string[] = [];
  write(svg, out, attribute, 0, true);
  return `${out.join('')}\n`;
}
