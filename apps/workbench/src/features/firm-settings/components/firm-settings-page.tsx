import { useState } from 'react';
import { PageHeader } from '../../../components/ui/page-header';
import { FormMessage } from '../../../components/ui/form-message';
import { useFirmSettings } from '../api/get-firm-settings';
import { FirmSettingsForm } from './firm-settings-form';

/** The owner's firm settings screen. */
export function FirmSettingsPage() {
  const settings = useFirmSettings();
  // a new key remounts the form with what was just loaded (after someone else's save)
  const [loadedAt, setLoadedAt] = useState(0);
  return (
    <div className="mx-auto flex max-w-5xl flex-col">
      <PageHeader eyebrow="Owner" title="Firm settings">
        Your firm’s details, the defaults new quotes start with, and the limits the circuit checks use.
      </PageHeader>
      {settings.data ? (
        <FirmSettingsForm
          key={loadedAt}
          initial={settings.data}
          onReload={() => void settings.refetch().then(() => setLoadedAt((n) => n + 1))}
        />
      ) : settings.isError ? (
        <FormMessage tone="error" title="Settings could not be loaded">
          {settings.error.message}
        </FormMessage>
      ) : (
        <p className="text-body text-ink-muted">Loading the settings…</p>
      )}
    </div>
  );
}
