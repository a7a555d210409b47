// zod's message languages, cut down to the one the app uses (see metro.config.cjs).
export { default as en } from 'zod/v4/locales/en.js';
