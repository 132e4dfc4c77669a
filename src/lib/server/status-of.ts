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

/** For service tests: the ServiceError a call throws; the test fails when the call succeeds. */
export function refusal(call: () => unknown): ServiceError {
	try {
		call();
	} catch (e) {
		if (e instanceof ServiceError) return e;
		throw e;
	}
	throw new Error('expected a refusal, but the call succeeded');
}
