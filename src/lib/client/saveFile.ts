/** Hands a file made in the browser to the user as a download (the exports of tables and pictures). */
export function saveFile(blob: Blob, filename: string): void {
	const url = URL.createObjectURL(blob);
	const a = document.createElement('a');
	a.href = url;
	a.download = filename;
	a.rel = 'noopener';
	document.body.appendChild(a);
	a.click();
	a.remove();
	// Some browsers read the blob after click() returns; keep it alive for a moment.
	setTimeout(() => URL.revokeObjectURL(url), 10_000);
}
