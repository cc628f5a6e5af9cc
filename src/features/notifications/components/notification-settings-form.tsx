import { useEffect } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  NOTIFICATION_KINDS,
  NOTIFICATION_KIND_LABELS,
  notificationSettingsInputSchema,
  type NotificationKind,
  type NotificationSettingsInput,
} from '@shared/schemas/notifications';
import { Alert, Button } from '@/components/ui';
import { useUpdateNotificationSettings } from '../api/update-notification-settings';

/**
 * One switch per kind: "mail me about this". The form holds the muted kinds, exactly what the server
 * stores; a box shows checked when its kind is NOT muted.
 */
export function NotificationSettingsForm({ mutedKinds }: { mutedKinds: NotificationKind[] }) {
  const update = useUpdateNotificationSettings();
  const form = useForm<NotificationSettingsInput>({ resolver: zodResolver(notificationSettingsInputSchema), defaultValues: { mutedKinds } });
  useEffect(() => form.reset({ mutedKinds }), [mutedKinds, form]);
  const muted = form.watch('mutedKinds');

  function toggle(kind: NotificationKind, mailMe: boolean) {
    const next = mailMe ? muted.filter((k) => k !== kind) : [...muted, kind];
    form.setValue('mutedKinds', next, { shouldDirty: true });
  }

  const submit = form.handleSubmit((values) => update.mutate(values));
  return (
    <form onSubmit={submit} noValidate className="space-y-4">
      <fieldset className="space-y-2">
        <legend className="font-medium">Mail me about</legend>
        <p className="text-sm text-ink-muted">Everything still appears under the bell in Kitlane; this only decides what is also mailed.</p>
        <div className="grid gap-2 sm:grid-cols-2">
          {NOTIFICATION_KINDS.map((kind) => (
            <label
              key={kind}
              className="flex cursor-pointer items-start gap-3 rounded-lg border border-line-strong bg-canvas-raised p-3 has-[:checked]:border-brand-700 has-[:checked]:bg-brand-50"
            >
              <input type="checkbox" className="mt-1 size-4 accent-brand-700" checked={!muted.includes(kind)} onChange={(e) => toggle(kind, e.target.checked)} />
              <span className="font-medium">{NOTIFICATION_KIND_LABELS[kind]}</span>
            </label>
          ))}
        </div>
      </fieldset>
      <div className="flex items-center gap-3">
        <Button type="submit" busy={update.isPending} busyLabel="Saving…" disabled={!form.formState.isDirty}>
          Save mail settings
        </Button>
      </div>
      {update.isSuccess && !form.formState.isDirty ? <Alert tone="success">Saved. Your mail settings are up to date.</Alert> : null}
      {update.isError ? (
        <Alert tone="error" title="Not saved">
          {update.error.message}
        </Alert>
      ) : null}
    </form>
  );
}
