import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import AjvDraft04 from 'ajv-draft-04';
import type { ErrorObject } from 'ajv';

/** A validator for the official nbformat v4.5 schema vendored in test/fixtures/nbformat/. */
export function nbformatValidator(): (doc: unknown) => { valid: boolean; errors: ErrorObject[] } {
  const schema = JSON.parse(readFileSync(join(import.meta.dirname, '..', 'fixtures', 'nbformat', 'nbformat.v4.5.schema.json'), 'utf8')) as object;
  const ajv = new AjvDraft04.default({ allErrors: true, strict: false });
  const validate = ajv.compile(schema);
  return (doc: unknown) => {
    const valid = validate(doc) as boolean;
    return { valid, errors: validate.errors ?? [] };
  };
}
