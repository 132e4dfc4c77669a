// Stand-in for SvelteKit's $env/dynamic/private when a script runs under tsx (see scripts/tsconfig.json).
export const env: Record<string, string | undefined> = process.env;
