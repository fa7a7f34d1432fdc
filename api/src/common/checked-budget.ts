import { UnprocessableEntityException } from '@nestjs/common';
import { formatZodIssues, LinkBudgetSchema, type LinkBudget } from '@beamwright/link-core';

/**
 * A budget computed by link-core, checked against LinkBudgetSchema before the API stores or answers
 * it. The engine is tested never to return a non-finite number for a design its schema accepts;
 * this is the guard for the day it does: a 422 naming each broken figure (`budget.linkMarginDb`),
 * never a stored `null` (JSON has no Infinity or NaN) or a 500.
 *
 * @param path where the budget sits in the answer: `budget`, or `variants.2.budget` for a variant's
 * @returns the budget itself, unchanged (the stored budget stays exactly evaluateLink's output)
 */
export function checkedBudget(budget: LinkBudget, path = 'budget'): LinkBudget {
  const result = LinkBudgetSchema.safeParse(budget);
  if (result.success) return budget;
  const issues = formatZodIssues(result.error).map((issue) => ({ path: issue.path ? `${path}.${issue.path}` : path, message: issue.message }));
  throw new UnprocessableEntityException({
    message: `The link budget of this design could not be computed (${issues[0]!.path} ${issues[0]!.message}); nothing was saved`,
    issues,
  });
}
