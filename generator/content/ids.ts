/**
 * Entry and set ids: file stems and `id:` values, named in URLs, PDF names and references.
 * The same pattern is in the JSON Schemas (`"pattern": "^[a-z0-9][a-z0-9-]*$"`).
 */

export const ID_PATTERN = /^[a-z0-9][a-z0-9-]*$/;

/** The id a person most likely meant: idLike('Bar Station') = 'bar-station'. */
export function idLike(text: string): string {
  const id = text
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
  return id === '' ? 'my-id' : id;
}
