// Ink that is measured but cannot be seen misleads as much as wrong geometry: verification refuses it.
// The rule that ink must be visible to count is our own (common practice, no source).
import { describe, expect, it } from 'vitest';
import { verifySvg } from '../../../shared-core/integrity/verifySvg';
import { normaliseColour } from '../../../shared-core/integrity/verifySvg';
import { renderChart } from '../../../shared-core/pipeline';
import { TallyError } from '../../../shared-core/errors';

const chart = (encoding: object, data: object[]) => ({ format: 'tallyglyph.chart/1', title: 'Visible ink', data, encoding, page: { width: 180, height: 120, unit: 'mm' } });

describe('verifySvg: the ink must show', () => {
  it('refuses a mark painted in the colour of the page', () => {
    let err: unknown;
    try {
      renderChart(chart({ mode: 'repeat', glyph: 'bike', unit: 1 }, [{ label: 'A', value: 3, color: '#ffffff' }, { label: 'B', value: 5 }]));
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(TallyError);
    expect((err as TallyError).message).toMatch(/"A" is painted in the colour of the page/);
  });

  it('refuses a fill chart whose filled and unfilled parts are one colour', () => {
    const honest = renderChart(chart({ mode: 'fill', glyph: 'heart' }, [{ label: 'A', value: 3 }, { label: 'B', value: 5 }])).svg;
    expect(verifySvg(honest).pass).toBe(true);
    // Repaint every unfilled piece in its mark's filled colour.
    const filledColour = /data-part="filled" fill="(#[0-9a-f]{6})"/.exec(honest)?.[1];
    expect(filledColour).toBeDefined();
    const flat = honest.replace(/data-part="rest" fill="#[0-9a-f]{6}"/g, `data-part="rest" fill="${filledColour}"`);
    expect(flat).not.toBe(honest);
    const report = verifySvg(flat);
    expect(report.pass).toBe(false);
    expect(report.problems.join(' ')).toMatch(/filled and unfilled parts of "A" are the same colour/);
  });

  it('refuses anything painted over a mark, and names how much ink it hides', () => {
    const honest = renderChart(chart({ mode: 'repeat', glyph: 'bike', unit: 1 }, [{ label: 'A', value: 3 }, { label: 'B', value: 5 }])).svg;
    const covered = honest.replace('</svg>', '<rect x="0" y="0" width="400" height="400" fill="#ffffff"/></svg>');
    const report = verifySvg(covered);
    expect(report.pass).toBe(false);
    expect(report.problems.join(' ')).toMatch(/Something painted after "A" covers [\d.]+ mm² of its ink/);
  });

  it('reads CSS colour spellings alike (CSS Color: #rgb is #rrggbb with each digit doubled)', () => {
    expect(normaliseColour('#FFF')).toBe('#ffffff');
    expect(normaliseColour('white')).toBe('#ffffff');
    expect(normaliseColour('rgb(255, 255, 255)')).toBe('#ffffff');
    expect(normaliseColour('#2f6f8f')).toBe('#2f6f8f');
  });
});
