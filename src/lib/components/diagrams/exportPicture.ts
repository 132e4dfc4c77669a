/**
 * Export of the diagrams as stand-alone pictures.
 *
 * The on-screen SVG takes its colours from CSS variables (light and dark theme) and its fonts
 * from the page's stylesheet. For a file that stands alone, each element's computed style is
 * copied inline as concrete values (rgb colours, px sizes, the font-family list), classes are
 * dropped, and a background rectangle in the current paper colour is put underneath.
 * PNG: the serialized SVG drawn into a canvas at 2× and saved with `toBlob`.
 */
import { saveFile } from '$lib/client/saveFile';

/** Presentation properties copied from the computed style onto the exported copy. */
const STYLE_PROPERTIES = [
	'fill',
	'fill-opacity',
	'stroke',
	'stroke-width',
	'stroke-opacity',
	'stroke-dasharray',
	'stroke-linecap',
	'stroke-linejoin',
	'opacity',
	'font-family',
	'font-size',
	'font-weight',
	'font-style',
	'text-anchor',
	'dominant-baseline',
	'letter-spacing',
	'paint-order'
] as const;

const SVG_NS = 'http://www.w3.org/2000/svg';

/** Size of the picture in CSS pixels, from the viewBox (or the rendered box). */
function pictureSize(svg: SVGSVGElement): { width: number; height: number } {
	const vb = svg.viewBox?.baseVal;
	if (vb && vb.width > 0 && vb.height > 0) return { width: vb.width, height: vb.height };
	const box = svg.getBoundingClientRect();
	return { width: Math.max(1, Math.round(box.width)), height: Math.max(1, Math.round(box.height)) };
}

/** The page's paper colour as a concrete value (the theme's --tc-paper), white if unset. */
function paperColour(svg: SVGSVGElement): string {
	const v = getComputedStyle(svg).getPropertyValue('--tc-paper').trim();
	return v || '#ffffff';
}

/**
 * The SVG element as a stand-alone SVG document (text starting with "<svg"), with computed
 * colours and fonts inlined and elements marked `data-export="skip"` left out.
 */
export function serializeSvg(svg: SVGSVGElement): string {
	const copy = svg.cloneNode(true) as SVGSVGElement;
	const originals = [svg, ...Array.from(svg.querySelectorAll('*'))];
	const copies = [copy, ...Array.from(copy.querySelectorAll('*'))];
	const drop: Element[] = [];
	const computedOf = new Map<Element, CSSStyleDeclaration>();
	originals.forEach((el, i) => {
		const target = copies[i];
		const computed = getComputedStyle(el);
		computedOf.set(el, computed);
		if (el.getAttribute('data-export') === 'skip' || computed.display === 'none') {
			drop.push(target);
			return;
		}
		// Inherited properties are written only where they differ from the parent, to keep the file small.
		const parent = el === svg ? undefined : computedOf.get(el.parentElement as Element);
		const style = STYLE_PROPERTIES.map((p) => {
			const v = computed.getPropertyValue(p);
			if (!v) return '';
			if (p === 'opacity') return v === '1' ? '' : `${p}:${v}`;
			if (parent && parent.getPropertyValue(p) === v) return '';
			return `${p}:${v}`;
		})
			.filter(Boolean)
			.join(';');
		if (style) target.setAttribute('style', style);
		else target.removeAttribute('style');
		target.removeAttribute('class');
		target.removeAttribute('tabindex');
	});
	drop.forEach((el) => el.remove());

	const { width, height } = pictureSize(svg);
	copy.setAttribute('xmlns', SVG_NS);
	copy.setAttribute('width', String(width));
	copy.setAttribute('height', String(height));
	if (!copy.getAttribute('viewBox')) copy.setAttribute('viewBox', `0 0 ${width} ${height}`);
	const ground = document.createElementNS(SVG_NS, 'rect');
	ground.setAttribute('x', '0');
	ground.setAttribute('y', '0');
	ground.setAttribute('width', String(width));
	ground.setAttribute('height', String(height));
	ground.setAttribute('fill', paperColour(svg));
	copy.insertBefore(ground, copy.firstChild);
	return new XMLSerializer().serializeToString(copy);
}

/** Saves the picture as an SVG file. */
export function downloadSvg(svg: SVGSVGElement, filename: string): void {
	saveFile(new Blob([serializeSvg(svg)], { type: 'image/svg+xml;charset=utf-8' }), filename);
}

/** Saves the picture as a PNG file at twice its CSS pixel size. */
export async function downloadPng(svg: SVGSVGElement, filename: string, scale = 2): Promise<void> {
	const text = serializeSvg(svg);
	const { width, height } = pictureSize(svg);
	const url = URL.createObjectURL(new Blob([text], { type: 'image/svg+xml;charset=utf-8' }));
	try {
		const img = new Image();
		img.src = url;
		await img.decode();
		const canvas = document.createElement('canvas');
		canvas.width = Math.ceil(width * scale);
		canvas.height = Math.ceil(height * scale);
		const ctx = canvas.getContext('2d');
		if (!ctx) throw new Error('This browser cannot draw into a canvas');
		ctx.scale(scale, scale);
		ctx.drawImage(img, 0, 0, width, height);
		const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/png'));
		if (!blob) throw new Error('The picture is too large to save as PNG; save it as SVG instead');
		saveFile(blob, filename);
	} finally {
		URL.revokeObjectURL(url);
	}
}

/** A file name from a configuration: "level-diagram-3d5-4s.svg". */
export function pictureFilename(kind: string, config: string, ext: 'svg' | 'png'): string {
	const slug = config
		.trim()
		.replace(/\[([A-Za-z]+)\]/g, '$1')
		.replace(/[^A-Za-z0-9]+/g, '-')
		.replace(/^-|-$/g, '');
	return `${kind}${slug ? '-' + slug : ''}.${ext}`;
}
