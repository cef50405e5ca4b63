// Plain data shared by the audit steps: measured marks in, readings and a report out.
import type { Warning } from '../errors';
import type { Box } from '../geometry/region';

/** How a reader may judge the size of a mark. */
export type ReadingName = 'length' | 'area' | 'volume' | 'count';

export const READING_NAMES: readonly ReadingName[] = ['length', 'area', 'volume', 'count'];

/** Units of every measurement in one audit: SVG root (viewBox) user units, or image pixels. */
export type SourceUnit = 'user unit' | 'pixel';

/** One sub-glyph of a mark: a child element or a connected piece of ink. */
export interface MarkPart {
  box: Box;
  inkAreaUnits2: number;
}

/** What makes a drawing look three-dimensional. */
export type SolidCue = 'parallelogram-faces' | 'elliptic-cap' | 'shaded-faces' | 'declared';

/** A mark measured in its source's units, whatever it was found in (SVG elements or raster pixels). */
export interface MeasuredMark {
  id: string;
  label: string;
  /** Bounding box of the ink. */
  box: Box;
  /** Ink area: the union of everything painted, not the box. */
  inkAreaUnits2: number;
  parts: MarkPart[];
  solidCues: SolidCue[];
  /** A value recorded in the file itself (data-value on a Tallyglyph chart's mark). */
  fileValue?: number;
  /** A length the user measured with two points; replaces the box side under the length reading. */
  givenLengthUnits?: number;
  /** Fill colours seen, as #rrggbb, for the report. */
  colours: string[];
}

export interface SetAside {
  kind: 'background' | 'connector' | 'small' | 'not-a-mark';
  description: string;
}

export interface AuditContext {
  source: 'svg' | 'raster';
  unit: SourceUnit;
  warnings: Warning[];
  setAside: SetAside[];
}
