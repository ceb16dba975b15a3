/** Words for the audit trail's actions. */
import type { AuditAction } from '../../../../server/contracts/audit';

export const ACTION_LABELS: Record<AuditAction, string> = {
  'auth.signed_in': 'signed in',
  'capture.uploaded': 'uploaded a capture',
  'capture.deleted': 'deleted a capture',
  'analysis.created': 'started an analysis',
  'analysis.retried': 'retried an analysis',
  'member.added': 'added a member',
  'member.role_changed': 'changed a role',
  'member.removed': 'removed a member',
  'invitation.created': 'invited someone',
  'invitation.accepted': 'accepted an invitation',
  'share_link.created': 'created a share link',
  'share_link.revoked': 'revoked a share link',
};
