/** Kept for the forms that import it from here; the helper lives in components/data/server-errors.ts. */
export { applyServerErrors } from '@/components/data/server-errors';
