/** The size attributes of a picture's root <svg> drawn at its own size: viewBox from the origin, width and height in px. */
export function svgSize(box: { width: number; height: number }) {
	return { viewBox: `0 0 ${box.width} ${box.height}`, width: box.width, height: box.height };
}
