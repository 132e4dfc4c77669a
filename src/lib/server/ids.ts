import { generateIdFromEntropySize } from 'lucia';

/** A random, URL-safe id (base32, 16 characters for 80 bits). */
export const newId = (): string => generateIdFromEntropySize(10);
