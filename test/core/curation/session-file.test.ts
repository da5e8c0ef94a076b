import { describe, expect, it } from 'vitest';
import { serializeSessionFile } from '../../../core/curation/serialize-session-file';
import { validateSessionFile } from '../../../core/curation/validate-session-file';
import { InputError } from '../../../core/errors';
import { makeSession } from '../node/helpers/make-session';

const good = () => JSON.parse(serializeSessionFile(makeSession(2, 2)));
const check = (mutate: (j: any) => void) => {
  const j = good();
  mutate(j);
  return () => validateSessionFile(JSON.stringify(j), 'my.session.json');
};

describe('validateSessionFile (schema version 1)', () => {
  it('accepts what serializeSessionFile writes and gives the same bytes back', () => {
    const text = serializeSessionFile(makeSession(2, 2));
    expect(serializeSessionFile(validateSessionFile(text, 'x.json'))).toBe(text);
  });
  it.each<[string, (j: any) => void, RegExp]>([
    ['not JSON', () => undefined, /^my\.session\.json: not valid JSON/],
    ['wrong format', (j) => (j.format = 'something-else'), /field format: expected "tagbench-session"; this is not a tagbench session file \(value "something-else"\)/],
    ['newer schema', (j) => (j.schemaVersion = 2), /field schemaVersion: version 2 was written by a newer tagbench \(this one reads up to 1\)/],
    ['unknown field', (j) => (j.extra = 1), /field extra: unknown field/],
    ['bad hash', (j) => (j.inputs[0].sha256 = 'xyz'), /field inputs\[0\]\.sha256: expected 64 lowercase hex digits \(value "xyz"\)/],
    ['bad bytes', (j) => (j.inputs[0].bytes = -1), /field inputs\[0\]\.bytes: expected a whole number of bytes/],
    ['unknown parameter', (j) => (j.parameters.quality.refractory = 2), /my\.session\.json \(field parameters\), column "quality\.refractory": unknown parameter/],
    ['wrong parameter type', (j) => (j.parameters.quality.refractoryMs = '2'), /column "quality\.refractoryMs".*expected a finite number/],
    ['duplicate units', (j) => (j.units = ['u0', 'u0']), /field units: unit ids repeat/],
    ['curation of an unknown unit', (j) => (j.curation.units.u9 = { labels: {} }), /field curation\.units\."u9": curation of a unit that is not in "units"/],
    ['bad label word', (j) => (j.curation.units.u0.labels.tag.value = 'yes'), /field curation\.units\."u0"\.labels\.tag\.value: expected one of tagged, borderline, untagged \(value "yes"\)/],
    ['label on a number column', (j) => (j.curation.units.u0.labels.rate_hz = j.curation.units.u0.labels.tag), /field curation\.units\."u0"\.labels\.rate_hz: not a verdict column/],
    ['missing who', (j) => delete j.curation.units.u1.note.by, /field curation\.units\."u1"\.note\.by: expected a non-empty string/],
    ['bad time', (j) => (j.curation.units.u1.note.at = '1 March'), /field curation\.units\."u1"\.note\.at: expected an ISO 8601 UTC time/],
    ['include not boolean', (j) => (j.curation.units.u1.include = { value: 'no', by: 'a', at: '2026-03-01T00:00:00Z' }), /field curation\.units\."u1"\.include\.value: expected true or false/],
  ])('rejects %s with an error naming file and field', (_name, mutate, re) => {
    const run = _name === 'not JSON' ? () => validateSessionFile('{"format": ', 'my.session.json') : check(mutate);
    expect(run).toThrow(InputError);
    expect(run).toThrow(re);
  });
});
