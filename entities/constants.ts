/**
 * The fixed value lists of the entities, in a file that imports nothing: the zod schemas in
 * lib/validations use them, and the forms import those schemas into the browser, where the ORM must not go.
 */
export const ROLES = ['coordinator', 'lead', 'cook'] as const;
export const LOCALES = ['en', 'fr'] as const;
export const TEMPERATURE_UNITS = ['C', 'F'] as const;
export const CHECK_IN_KINDS = ['started', 'done', 'skipped'] as const;
export const COOKER_KINDS = ['dish', 'trough', 'box', 'evacuated-tube'] as const;
export const TRACKING_MODES = ['fixed', 'one-axis', 'two-axis'] as const;
export const COOK_METHODS = ['boil', 'simmer', 'steam', 'bake', 'fry'] as const;
export const UPLOAD_MODES = ['as-is', 'typical-day'] as const;
