// The site pack's shape version, apart from its zod schema (lib/sites/pack-schema.ts): the phone's
// store checks it on every page, and importing the schema for one number would put zod there too.

/** Bumped when the shape changes; a phone drops a stored pack of another version and fetches anew. */
export const SITE_PACK_VERSION = 2;
