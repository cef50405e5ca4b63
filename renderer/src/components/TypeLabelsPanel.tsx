// The words on the chart: which labels show, their place and size, the value labels' unit, the font and
// the key's wording. Each applies as it is typed and is one undo step per visit.
import type { ReactElement } from 'react';
import type { Action } from '../editor/actions';
import type { EditorDocument } from '../editor/editorDocument';

interface TypeLabelsPanelProps {
  doc: EditorDocument;
  dispatch: (action: Action) => void;
  seal: () => void;
}

export function TypeLabelsPanel({ doc, dispatch }: TypeLabelsPanelProps): ReactElement {
  const layout = doc.layout;
  return (
    <div className="type-labels-panel">
      <div className="field">
        <span className="field-label">Show</span>
        <div className="checks">
          <label className="check">
            <input type="checkbox" checked={layout.labels} data-testid="show-labels" onChange={(e) => dispatch({ type: 'set-show', what: 'labels', on: e.target.checked })} /> Category labels
          </label>
          <label className="check">
            <input type="checkbox" checked={layout.valueLabels} data-testid="show-values" onChange={(e) => dispatch({ type: 'set-show', what: 'valueLabels', on: e.target.checked })} /> Values
          </label>
          <label className="check">
            <input type="checkbox" checked={layout.legend} data-testid="show-key" onChange={(e) => dispatch({ type: 'set-show', what: 'legend', on: e.target.checked })} /> Key
          </label>
        </div>
      </div>
    </div>
  );
}
