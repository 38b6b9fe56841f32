import { useId, useState } from 'react';
import { MAX_COMPARISON_COMMENT_LENGTH } from '../../../../api/contracts/comparisons';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { controlClasses } from '../../../components/input';
import { describeError } from '../../../components/query-state';
import { TextLink } from '../../../components/text-link';
import { paths } from '../../../config/paths';
import { cn } from '../../../lib/cn';
import { useSaveComparison } from '../api/save-comparison';

/**
 * Saves the comparison of `fitRunIds` (reference first) with a comment and links the saved page.
 * For users without fits:compare it shows why there is no button instead.
 */
export function SaveComparisonForm({ pulsarId, fitRunIds, canSave }: { pulsarId: string; fitRunIds: number[]; canSave: boolean }) {
  const commentId = useId();
  const [comment, setComment] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const save = useSaveComparison(pulsarId);
  if (!canSave) {
    return (
      <p className="text-sm text-night-300">
        Saving a comparison with a comment is for group leads. You can share this page’s address: it opens the same comparison.
      </p>
    );
  }
  const submit = () => {
    const trimmed = comment.trim();
    if (trimmed.length === 0) return setProblem('Comment: say what this comparison shows, e.g. which model you prefer and why.');
    if (trimmed.length > MAX_COMPARISON_COMMENT_LENGTH)
      return setProblem(`Comment: at most ${MAX_COMPARISON_COMMENT_LENGTH} characters (now ${trimmed.length}).`);
    setProblem(null);
    save.mutate({ fitRunIds, comment: trimmed });
  };
  return (
    <form
      aria-label="Save comparison"
      className="flex flex-col gap-3"
      onSubmit={(event) => {
        event.preventDefault();
        submit();
      }}
    >
      <label htmlFor={commentId} className="text-sm font-medium text-night-100">
        Comment
      </label>
      <textarea
        id={commentId}
        rows={3}
        maxLength={MAX_COMPARISON_COMMENT_LENGTH + 50}
        value={comment}
        onChange={(event) => setComment(event.target.value)}
        aria-invalid={problem ? true : undefined}
        aria-describedby={`${commentId}-hint`}
        className={cn(controlClasses, 'h-auto py-2')}
      />
      <p id={`${commentId}-hint`} className="text-xs text-night-400">
        Saved with the runs in this order (run #{fitRunIds[0]} as reference); the saved page recomputes the figures from the stored fits.
      </p>
      {problem ? <p className="text-xs font-medium text-alarm-300">{problem}</p> : null}
      {save.isError ? <Alert tone="error">{describeError(save.error)}</Alert> : null}
      {save.isSuccess ? (
        <Alert tone="success" title={`Saved as comparison #${save.data.id}`}>
          <TextLink to={paths.savedComparison.href(save.data.id)}>Open saved comparison #{save.data.id}</TextLink>
        </Alert>
      ) : null}
      <div>
        <Button type="submit" busy={save.isPending}>
          Save comparison
        </Button>
      </div>
    </form>
  );
}
