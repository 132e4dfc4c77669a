/** For service tests: 'ok' when the call succeeds, the HTTP status of the ServiceError it throws otherwise. */
import { ServiceError } from './errors';

export function statusOf(call: () => unknown): number | 'ok' {
	try {
		call();
		return 'ok';
	} catch (e) {
		if (e instanceof ServiceError) return e.status;
		throw e;
	}
}
