/**
 * Files out of the page: a download of text or bytes, and an SVG figure rasterised to PNG through a canvas
 * (the browser's own renderer; the CLI uses its own rasteriser for `plot --png`).
 */
export function download(doc: Document, name: string, data: Blob): void {
  const url = URL.createObjectURL(data);
  const link = doc.createElement('a');
  link.href = url;
  link.download = name;
  link.style.display = 'none';
  doc.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

export function svgText(svg: SVGSVGElement): string {
  const text = new XMLSerializer().serializeToString(svg);
  return `<?xml version="1.0" encoding="UTF-8"?>\n${text}\n`;
}

/** PNG of an SVG at `scale` device pixels per CSS pixel, on a white ground. */
export async function svgToPng(svg: SVGSVGElement, scale = 3): Promise<Blob> {
  const width = Number(svg.getAttribute('width')) || svg.viewBox.baseVal.width;
  const height = Number(svg.getAttribute('height')) || svg.viewBox.baseVal.height;
  const url = URL.createObjectURL(new Blob([svgText(svg)], { type: 'image/svg+xml' }));
  try {
    const image = new Image();
    image.decoding = 'sync';
    await new Promise<void>((resolve, reject) => {
      image.onload = () => resolve();
      image.onerror = () => reject(new Error('the figure could not be drawn as an image'));
      image.src = url;
    });
    const canvas = document.createElement('canvas');
    canvas.width = Math.round(width * scale);
    canvas.height = Math.round(height * scale);
    const context = canvas.getContext('2d')!;
    context.fillStyle = '#ffffff';
    context.fillRect(0, 0, canvas.width, canvas.height);
    context.drawImage(image, 0, 0, canvas.width, canvas.height);
    return await new Promise<Blob>((resolve, reject) => canvas.toBlob((blob) => (blob ? resolve(blob) : reject(new Error('PNG encoding failed'))), 'image/png'));
  } finally {
    URL.revokeObjectURL(url);
  }
}
