import type { Issue } from '../../core/result';

/** Why core could not review the case, in its own words. */
export function ReviewProblem({ issues }: { readonly issues: readonly Issue[] }) {
  return (
    <div role="alert" className="field-errors">
      <p>The review could not be computed:</p>
      <ul>{issues.map((issue) => <li key={issue.message}>{issue.message}</li>)}</ul>
    </div>
  );
}
