// Answers requests that Node's HTTP parser rejects before the app sees them (an over-long URL
// or header block: 431; a malformed request: 400) in the API's one error shape, as JSON.
// Node's default would write a bare status line with no body.

/**
 * The raw HTTP answer for a parser error `code` (Node's `err.code`, e.g. HPE_HEADER_OVERFLOW).
 * @param {string | undefined} code
 * @returns {string}
 */
export function clientErrorResponse(code) {
	const tooLarge = code === 'HPE_HEADER_OVERFLOW';
	const status = tooLarge ? '431 Request Header Fields Too Large' : '400 Bad Request';
	const message = tooLarge
		? 'The request line or headers are over the server limit (16 KB); send long input in a POST body instead of the URL'
		: 'The request could not be parsed as HTTP';
	const body = JSON.stringify({ error: { message } });
	return (
		`HTTP/1.1 ${status}\r\ncontent-type: application/json; charset=utf-8\r\n` +
		`content-length: ${Buffer.byteLength(body)}\r\nx-content-type-options: nosniff\r\nconnection: close\r\n\r\n${body}`
	);
}

/**
 * Installs the handler on a node:http server.
 * @param {import('node:http').Server} server
 */
export function answerClientErrorsAsJson(server) {
	server.on('clientError', (/** @type {Error & { code?: string }} */ err, /** @type {import('node:stream').Duplex} */ socket) => {
		if (err.code === 'ECONNRESET' || !socket.writable) {
			socket.destroy();
			return;
		}
		socket.end(clientErrorResponse(err.code));
	});
}
