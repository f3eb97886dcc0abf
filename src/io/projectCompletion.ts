/** A project's dates as a projects file writes them. */
export interface WrittenProjectDates {
  readonly completed?: string;
  readonly completedYear?: number;
  readonly constructionStart?: string;
}

/** When a project's works ran: the day they finished, and the day they began if known. */
export interface ProjectWorks {
  readonly completed: string;
  readonly constructionStart?: string;
}

/**
 * The works period a project states: `completed` as written, or for `completedYear` alone that
 * year's last day, with the whole year as construction (its first day as the start) unless a
 * constructionStart is given. Undefined when the project gives both completion fields or neither.
 * @example projectCompletion({ completedYear: 2020 }) → { completed: "2020-12-31", constructionStart: "2020-01-01" }
 */
export function projectCompletion(project: WrittenProjectDates): ProjectWorks | undefined {
  const hasDay = project.completed !== undefined;
  const hasYear = project.completedYear !== undefined;
  if (hasDay === hasYear) return undefined;
  const completed = hasDay ? project.completed! : `${project.completedYear}-12-31`;
  const constructionStart = project.constructionStart ?? (hasYear ? `${project.completedYear}-01-01` : undefined);
  return { completed, ...(constructionStart !== undefined && { constructionStart }) };
}
