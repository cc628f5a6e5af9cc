import { ROLE_LABELS, SELF_CHOSEN_ROLES } from '@shared/permissions';
import type { CheckboxOption } from '@/components/ui';

// What each role means in one line, for people new to the trade. Admin is never offered (DESIGN.md).
const ROLE_DESCRIPTIONS: Record<(typeof SELF_CHOSEN_ROLES)[number], string> = {
  songwriter: 'I have songs and want drums recorded for them.',
  drummer: 'I record drum parts for other people’s songs.',
  engineer: 'I run a room and mics that drummers record in.',
};

export const ROLE_OPTIONS: CheckboxOption[] = SELF_CHOSEN_ROLES.map((role) => ({
  value: role,
  label: ROLE_LABELS[role],
  description: ROLE_DESCRIPTIONS[role],
}));
