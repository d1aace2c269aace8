import { sveltekit } from '@sveltejs/kit/vite';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [tailwindcss(), sveltekit()],
	server: { host: '127.0.0.1' },
	test: {
		projects: [
			{
				extends: true,
				test: {
					name: 'unit',
					environment: 'node',
					include: ['src/**/*.test.ts'],
					// Timeouts only catch a hang: the property tests run thousands of cases and must not
					// fail because the machine is busy.
					testTimeout: 60_000
				}
			},
			{
				extends: true,
				test: {
					name: 'integration',
					environment: 'node',
					include: ['tests/integration/**/*.test.ts'],
					globalSetup: ['tests/integration/global-setup.ts'],
					setupFiles: ['tests/integration/setup.ts'],
					testTimeout: 120_000,
					hookTimeout: 120_000
				}
			},
			{
				// A clean clone installed, built and pruned as in production; slow, so its own step of `npm test`.
				extends: true,
				test: {
					name: 'install',
					environment: 'node',
					include: ['tests/install/**/*.test.ts'],
					globalSetup: ['tests/integration/global-setup.ts'],
					testTimeout: 900_000,
					hookTimeout: 120_000
				}
			}
		]
	}
});
