import { describe, expect, it } from 'vitest';
import { TallyError } from '../../../shared-core/errors';
import {
  HOST_CHANNELS,
  HOST_LIMITS,
  failureFromError,
  methodForChannel,
  parseHostRequest,
  parseHostResult,
  parseMenuCommand,
  safeFileName,
} from '../../../shared-core/host';

describe('channel allowlist', () => {
  it('maps every channel to its method and nothing else to anything', () => {
    for (const [method, channel] of Object.entries(HOST_CHANNELS)) expect(methodForChannel(channel)).toBe(method);
    expect(new Set(Object.values(HOST_CHANNELS)).size).toBe(Object.keys(HOST_CHANNELS).length);
    expect(methodForChannel('tallyglyph:delete-everything')).toBeNull();
    expect(methodForChannel('openChart')).toBeNull();
    expect(methodForChannel(42)).toBeNull();
  });
});

describe('parseHostRequest', () => {
  it('accepts a well-formed request', () => {
    expect(parseHostRequest('exportPng', { svg: '<svg/>', suggestedName: 'Bikes 2025.png', ppi: 300 })).toEqual({ svg: '<svg/>', suggestedName: 'Bikes 2025.png', ppi: 300 });
    expect(parseHostRequest('listRecent', undefined)).toEqual({});
  });

  it('refuses extra fields, paths in names, odd resolutions and oversized payloads', () => {
    const bad: Array<[Parameters<typeof parseHostRequest>[0], unknown]> = [
      ['exportSvg', { svg: '<svg/>', suggestedName: 'a.svg', path: '/etc/passwd' }],
      ['exportSvg', { svg: '<svg/>', suggestedName: '../../a.svg' }],
      ['exportSvg', { svg: '<svg/>', suggestedName: 'C:\\temp\\a.svg' }],
      ['exportSvg', { svg: '<svg/>', suggestedName: '.hidden.svg' }],
      ['exportSvg', { svg: '', suggestedName: 'a.svg' }],
      ['exportPng', { svg: '<svg/>', suggestedName: 'a.png', ppi: 0 }],
      ['exportPng', { svg: '<svg/>', suggestedName: 'a.png', ppi: Number.NaN }],
      ['exportPng', { svg: '<svg/>', suggestedName: 'a.png', ppi: HOST_LIMITS.maxPpi + 1 }],
      ['openChart', { documentId: '../x' }],
      ['saveChart', { text: 'x'.repeat(HOST_LIMITS.maxDocumentChars + 1), suggestedName: 'a.json' }],
      ['saveChart', 'just a string'],
    ];
    for (const [method, payload] of bad) {
      expect(() => parseHostRequest(method, payload), `${method} ${JSON.stringify(payload).slice(0, 80)}`).toThrow(TallyError);
    }
  });
});

describe('parseHostResult', () => {
  it('passes a valid reply and a failure through', () => {
    expect(parseHostResult('exportSvg', { ok: true, value: { name: 'a.svg', bytes: 10 } })).toEqual({ ok: true, value: { name: 'a.svg', bytes: 10 } });
    expect(parseHostResult('exportSvg', { ok: true, value: null })).toEqual({ ok: true, value: null });
    expect(parseHostResult('openChart', { ok: false, error: { code: 'io-error', message: 'Could not open.' } })).toEqual({ ok: false, error: { code: 'io-error', message: 'Could not open.' } });
  });

  it('turns anything off-contract into a failure instead of throwing', () => {
    for (const payload of [undefined, null, 'ok', { ok: true, value: { name: 'a.svg' } }, { ok: true, value: { name: '/abs/a.svg', bytes: 1 } }, { ok: false, error: 'boom' }]) {
      const r = parseHostResult('exportSvg', payload);
      expect(r.ok).toBe(false);
      expect(!r.ok && r.error.code).toBe('host-invalid');
    }
  });
});

describe('parseMenuCommand', () => {
  it('accepts only known commands', () => {
    expect(parseMenuCommand({ command: 'undo' })).toBe('undo');
    expect(parseMenuCommand({ command: 'format-disk' })).toBeNull();
    expect(parseMenuCommand('undo')).toBeNull();
  });
});

describe('failureFromError', () => {
  it('keeps a TallyError’s code and sentence', () => {
    expect(failureFromError(new TallyError('gate-refused', 'Refused.'))).toEqual({ ok: false, error: { code: 'gate-refused', message: 'Refused.' } });
    const plain = failureFromError(new Error('disk on fire'));
    expect(!plain.ok && plain.error.code).toBe('host-error');
  });
});

describe('safeFileName', () => {
  it('gives a plain name that the request schema accepts', () => {
    const cases = ['Wrenfield bike share: rides in one week', '../../etc/passwd', '  .hidden ', 'a/b\\c', '', 'x'.repeat(500), 'chart.json'];
    for (const c of cases) {
      const name = safeFileName(c, 'svg');
      expect(name.endsWith('.svg')).toBe(true);
      expect(() => parseHostRequest('exportSvg', { svg: '<svg/>', suggestedName: name }), name).not.toThrow();
    }
    expect(safeFileName('Bikes: week 1', 'png')).toBe('Bikes week 1.png');
    expect(safeFileName('chart.json', 'svg')).toBe('chart.svg');
  });
});
