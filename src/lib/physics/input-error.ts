/**
 * Bad input to the engine: the message says what is wrong and what is allowed, `token` is the
 * offending piece of what was typed ('' when it is the input as a whole). The API answers 400 with both.
 */
export class InputError extends Error {
	readonly token: string;
	constructor(message: string, token: string) {
		super(message);
		this.name = 'InputError';
		this.token = token;
	}
}
