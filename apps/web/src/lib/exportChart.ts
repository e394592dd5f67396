import { downloadBlob } from './download';

/** Serialises an SVG element with its computed colours inlined enough to stand alone. */
export function svgToString(svg: SVGSVGElement): string {
  const clone = svg.cloneNode(true) as SVGSVGElement;
  clone.setAttribute('xmlns', 'http://www.w3.org/2000/svg');
  const { width, height } = svg.viewBox.baseVal ?? { width: 0, height: 0 };
  if (width && height) {
    clone.setAttribute('width', String(width));
    clone.setAttribute('height', String(height));
  }
  const style = document.createElementNS('http://www.w3.org/2000/svg', 'style');
  style.textContent = "text{font-family:'IBM Plex Sans',sans-serif;font-size:11px;fill:#12263a}";
  clone.insertBefore(style, clone.firstChild);
  return new XMLSerializer().serializeToString(clone);
}

export function exportSvg(svg: SVGSVGElement, fileName: string): void {
  downloadBlob(new Blob([svgToString(svg)], { type: 'image/svg+xml' }), `${fileName}.svg`);
}

/** Draws the SVG on a canvas at twice its size and saves a PNG. */
export async function exportPng(svg: SVGSVGElement, fileName: string, scale = 2): Promise<void> {
  const text = svgToString(svg);
  const { width, height } = svg.viewBox.baseVal;
  const image = new Image();
  const url = URL.createObjectURL(new Blob([text], { type: 'image/svg+xml' }));
  try {
    await new Promise<void>((resolve, reject) => {
      image.onload = () => resolve();
      image.onerror = () => reject(new Error('The chart could not be drawn as an image.'));
      image.src = url;
    });
    const canvas = document.createElement('canvas');
    canvas.width = Math.round(width * scale);
    canvas.height = Math.round(height * scale);
    const context = canvas.getContext('2d');
    if (!context) throw new Error('This browser cannot draw on a canvas.');
    context.fillStyle = '#fffdf8';
    context.fillRect(0, 0, canvas.width, canvas.height);
    context.drawImage(image, 0, 0, canvas.width, canvas.height);
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/png'));
    if (!blob) throw new Error('The PNG could not be made.');
    downloadBlob(blob, `${fileName}.png`);
  } finally {
    URL.revokeObjectURL(url);
  }
}
