import { LOGO_MAX_BYTES, type FirmSettingsResponse } from '@gloaming/contracts';
import { useEffect, useId, useMemo, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { FieldErrorText } from '../../../components/ui/text-field';
import { isApiError } from '../../../lib/api-error';
import { firmLogoUrl, useRemoveFirmLogo, useUploadFirmLogo } from '../api/firm-logo';

const ACCEPT = 'image/png,image/jpeg,image/webp';

/** The firm's logo: the one in use, a preview of a chosen file before it is uploaded, and removal. */
export function LogoPanel({ logo, onChanged }: { logo: FirmSettingsResponse['logo']; onChanged: (answer: FirmSettingsResponse) => void }) {
  const id = useId();
  const upload = useUploadFirmLogo();
  const remove = useRemoveFirmLogo();
  const [current, setCurrent] = useState(logo);
  const [file, setFile] = useState<File | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  // the chosen file shown before it is uploaded; its object URL is let go when the file changes
  const preview = useMemo(() => (file ? URL.createObjectURL(file) : null), [file]);
  useEffect(() => (preview ? () => URL.revokeObjectURL(preview) : undefined), [preview]);

  const done = (answer: FirmSettingsResponse) => {
    setCurrent(answer.logo);
    setFile(null);
    setProblem(null);
    onChanged(answer);
  };
  const failed = (err: unknown) => setProblem(isApiError(err) ? err.detail : 'The logo could not be saved. Try again.');

  return (
    <div className="mt-6 flex flex-wrap items-start gap-6 border-t border-line pt-5">
      <figure className="flex h-24 w-48 items-center justify-center rounded-control bg-mist-50 ring-1 ring-line">
        {preview ? (
          <img src={preview} alt="Preview of the chosen logo" className="max-h-20 max-w-44 object-contain" />
        ) : current ? (
          <img src={firmLogoUrl(current.updatedAt)} alt="The firm’s logo" className="max-h-20 max-w-44 object-contain" />
        ) : (
          <figcaption className="text-caption text-ink-muted">No logo yet</figcaption>
        )}
      </figure>
      <div className="flex min-w-0 flex-1 flex-col gap-2">
        <label htmlFor={id} className="text-caption font-semibold text-mist-800">
          Logo
        </label>
        <input
          id={id}
          type="file"
          accept={ACCEPT}
          aria-describedby={problem ? `${id}-error` : `${id}-hint`}
          className="text-caption file:mr-3 file:h-9 file:rounded-control file:border-0 file:bg-dusk-50 file:px-3 file:font-semibold file:text-dusk-800"
          onChange={(e) => {
            const chosen = e.target.files?.[0] ?? null;
            setProblem(null);
            if (chosen && chosen.size > LOGO_MAX_BYTES) {
              setFile(null);
              setProblem(`That file is ${(chosen.size / 1024 / 1024).toFixed(1)} MB; a logo can be at most ${LOGO_MAX_BYTES / 1024 / 1024} MB.`);
              return;
            }
            setFile(chosen);
          }}
        />
        <p id={`${id}-hint`} className="text-caption text-ink-muted">
          PNG, JPEG or WebP up to {LOGO_MAX_BYTES / 1024 / 1024} MB. It is stored as a PNG at most 800 pixels wide, for quotes and the customer’s page.
        </p>
        {problem ? <FieldErrorText id={`${id}-error`}>{problem}</FieldErrorText> : null}
        <div className="flex flex-wrap gap-3">
          <Button variant="secondary" className="h-9" disabled={!file} busy={upload.isPending} onClick={() => file && upload.mutate(file, { onSuccess: done, onError: failed })}>
            Upload logo
          </Button>
          {file ? (
            <Button variant="quiet" className="h-9" onClick={() => setFile(null)}>
              Keep the current one
            </Button>
          ) : null}
          {current && !file ? (
            <Button variant="quiet" className="h-9" busy={remove.isPending} onClick={() => remove.mutate(undefined, { onSuccess: done, onError: failed })}>
              Remove logo
            </Button>
          ) : null}
        </div>
      </div>
    </div>
  );
}
