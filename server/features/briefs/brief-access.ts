import type { CurrentUser } from '../../auth/middleware';
import { forbidden, notFound } from '../../http/app-error';
import { can } from '@shared/permissions';
import type { BriefRow, BriefsRepository } from './briefs.repository';

/**
 * Who may see a brief (DESIGN.md: only open briefs are visible to drummers):
 * - the owner, always;
 * - nobody else while it is a draft (404, so a draft's existence never leaks);
 * - while open: drummers and admins;
 * - after that (hired, closed, withdrawn): admins, and the drummers who quoted on it or were invited.
 */
export function canSeeBrief(repo: BriefsRepository, user: CurrentUser, brief: BriefRow): boolean {
  if (brief.songwriterId === user.id) return true;
  if (brief.status === 'draft') return false;
  if (!can(user.roles, 'read:brief:open')) return false;
  if (brief.status === 'open' || user.roles.includes('admin')) return true;
  return !!repo.quoteOf(brief.id, user.id) || repo.isInvited(brief.id, user.id);
}

export function loadVisibleBrief(repo: BriefsRepository, user: CurrentUser, id: string): BriefRow {
  const brief = repo.findById(id);
  if (!brief || !canSeeBrief(repo, user, brief)) throw notFound('That brief');
  return brief;
}

/** The owner's own brief: 404 when the reader cannot see it at all, 403 when they can but do not own it. */
export function loadOwnBrief(repo: BriefsRepository, user: CurrentUser, id: string): BriefRow {
  const brief = loadVisibleBrief(repo, user, id);
  if (brief.songwriterId !== user.id) throw forbidden('Only the songwriter who wrote this brief can do that');
  return brief;
}
