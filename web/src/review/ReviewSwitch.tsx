import { useCommandContext } from '../editor/useEditor';
import { setReviewMode, useReviewView } from './reviewState';

/** The visible review-mode switch for the top bar, with who is writing. */
export function ReviewSwitch() {
  const { store } = useCommandContext();
  const on = useReviewView((v) => v.on);
  const author = useReviewView((v) => v.author);
  return (
    <div className={`lw-rv-switch${on ? ' is-on' : ''}`} role="group" aria-label="Review">
      <label title="Review mode: the drawing is read-only; only comments and dispositions of findings can change">
        <input type="checkbox" role="switch" aria-checked={on} checked={on} onChange={(e) => setReviewMode(store, e.target.checked)} data-testid="review-mode" />
        Review mode{on ? ' (read-only)' : ''}
      </label>
      {author && (
        <span className="lw-rv-who" data-testid="review-who">
          {author.name} ({author.role})
        </span>
      )}
    </div>
  );
}
