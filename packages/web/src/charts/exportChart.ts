/** Save a rendered chart as a standalone SVG file or as a PNG at twice its on-screen size. */

function serialize(svg: SVGSVGElement): string {
  const clone = svg.cloneNode(true) as SVGSVGElement;
  clone.setAttribute('xmlns', 'http://www.w3.org/2000/svg');
  const { width, height } = svg.viewBox.baseVal;
  if (width && height) {
    clone.setAttribute('width', String(width));
    clone.setAttribute('height', String(height));
  }
  // A white ground so the file reads the same on dark viewers.
  const bg = document.createElementNS('http://www.w3.org/2000/svg', 'rect');
  bg.setAttribute('width', '100%');
  bg.setAttribute('height', '100%');
  bg.setAttribute('fill', '#ffffff');
  clone.insertBefore(bg, clone.firstChild);
  return new XMLSerializer().serializeToString(clone);
}

function download(blob: Blob, filename: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = filename;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

export function downloadSvg(svg: SVGSVGElement, name: string): void {
  download(new Blob([serialize(svg)], { type: 'image/svg+xml' }), `${name}.svg`);
}

export async function downloadPng(svg: SVGSVGElement, name: string, scale = 2): Promise<void> {
  const { width, height } = svg.viewBox.baseVal;
  const url = URL.createObjectURL(new Blob([serialize(svg)], { type: 'image/svg+xml' }));
  try {
    const img = new Image();
    await new Promise<void>((resolve, reject) => {
      img.onload = () => resolve();
      img.onerror = () => reject(new Error('could not render the chart'));
      img.src = url;
    });
    const canvas = document.createElement('canvas');
    canvas.width = Math.round(width * scale);
    canvas.height = Math.round(height * scale);
    const ctx = canvas.getContext('2d');
    if (!ctx) throw new Error('no 2D canvas');
    ctx.scale(scale, scale);
    ctx.drawImage(img, 0, 0, width, height);
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/png'));
    if (blob) download(blob, `${name}.png`);
  } finally {
    URL.revokeObjectURL(url);
  }
}

/** Download text (CSV, JSON) produced in the browser. */
export function downloadText(text: string, filename: string, type: string): void {
  download(new Blob([text], { type }), filename);
}
