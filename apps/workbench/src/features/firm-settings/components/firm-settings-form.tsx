import { zodResolver } from '@hookform/resolvers/zod';
import {
  CABLE_METHOD_LABELS,
  CABLE_METHODS,
  FIRM_CURRENCIES,
  FIRM_LOCALES,
  INSTALLATION_LOCATION_LABELS,
  INSTALLATION_LOCATIONS,
  UpdateFirmSettingsRequest,
  VAT_ROUNDINGS,
  type FirmSettings,
  type FirmSettingsResponse,
  type VatRounding,
} from '@gloaming/contracts';
import { DEFAULT_MINIMUM_IP } from '@gloaming/engine';
import { useState } from 'react';
import { Controller, get, useForm, type Resolver } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { FormMessage } from '../../../components/ui/form-message';
import { SelectField } from '../../../components/ui/select-field';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { TextField } from '../../../components/ui/text-field';
import { applyServerErrors } from '../../../lib/server-field-errors';
import { useSaveFirmSettings } from '../api/save-firm-settings';
import { ratesFromDisplay, ratesToDisplay } from '../settings-units';
import { LogoPanel } from './logo-panel';
import { ScaledField } from './scaled-field';

/** What the form holds: the request as the contract takes it (version + every setting). */
export type SettingsFormValues = UpdateFirmSettingsRequest;
type Parsed = { version: number; settings: FirmSettings };

/** An IP minimum left blank means "the default": it is not sent. */
function pruneBlankIp(values: SettingsFormValues): SettingsFormValues {
  const ip = Object.fromEntries(Object.entries(values.settings.design.ipMinimums ?? {}).filter(([, v]) => typeof v === 'string' && v.trim() !== ''));
  return { ...values, settings: { ...values.settings, design: { ...values.settings.design, ipMinimums: ip } } };
}

const resolver: Resolver<SettingsFormValues, unknown, Parsed> = (values, context, options) =>
  zodResolver(UpdateFirmSettingsRequest)(pruneBlankIp(values), context, options as never) as ReturnType<Resolver<SettingsFormValues, unknown, Parsed>>;

/** The form's starting values: every text field a string (a blank IP minimum is ''), so an untouched form is not dirty. */
export function formValuesOf(answer: FirmSettingsResponse): SettingsFormValues {
  const { settings } = answer;
  const ipMinimums = Object.fromEntries(INSTALLATION_LOCATIONS.map((loc) => [loc, settings.design.ipMinimums[loc] ?? '']));
  return { version: answer.version, settings: { ...settings, vatNumber: settings.vatNumber ?? '', design: { ...settings.design, ipMinimums } } };
}

const VAT_ROUNDING_LABELS: Record<VatRounding, string> = {
  'line-down-0.1p': 'Each line, down to 0.1 p',
  'line-nearest-1p': 'Each line, to the nearest penny',
  'line-nearest-0.5p': 'Each line, to the nearest half penny',
  'invoice-down-1p': 'On the total, down to a penny',
};
const CODE_PROFILES = [
  { value: 'uk-iec', label: 'UK / IEC (BS 7671 style)' },
  { value: 'us-nec', label: 'US (NEC style)' },
];
const LOCALE_LABELS: Record<(typeof FIRM_LOCALES)[number], string> = {
  'en-GB': 'English (United Kingdom)',
  'en-IE': 'English (Ireland)',
  'en-US': 'English (United States)',
};

const isKnownField = (path: string) => path.startsWith('settings.');

/**
 * Every firm setting in one form, checked with the contract's schema before it is sent; the
 * api's field errors land beside their fields, a stale version is explained with a way to load
 * the newer settings.
 */
export function FirmSettingsForm({ initial, onReload }: { initial: FirmSettingsResponse; onReload: () => void }) {
  const save = useSaveFirmSettings();
  const [message, setMessage] = useState<{ title: string; detail: string; stale?: boolean } | undefined>();
  const [saved, setSaved] = useState(false);
  // the settings as last read or saved: the version the form sends belongs to them
  const [base, setBase] = useState(initial);
  const form = useForm<SettingsFormValues, unknown, Parsed>({ resolver, defaultValues: formValuesOf(initial) });
  const { register, control, formState } = form;
  const error = (path: string): string | undefined => (get(formState.errors, path) as { message?: string } | undefined)?.message;
  const s = (path: string) => `settings.${path}`;

  const submit = form.handleSubmit(
    (request) => {
      setMessage(undefined);
      setSaved(false);
      save.mutate(request, {
        onSuccess: (answer) => {
          setBase(answer);
          form.reset(formValuesOf(answer));
          setSaved(true);
        },
        onError: (err) => {
          const m = applyServerErrors(err, form.setError, isKnownField);
          setMessage(m ? { ...m, stale: m.title === 'Changed by someone else' } : undefined);
        },
      });
    },
    () => {
      setSaved(false);
      setMessage({ title: 'Some settings need a look', detail: 'Each one is marked beside the field with what to change.' });
    },
  );

  const scaled = (path: string, label: string, scale: number, unit: string, hint?: string) => (
    <Controller
      control={control}
      name={s(path) as never}
      render={({ field }) => (
        <ScaledField
          label={label}
          name={field.name}
          value={field.value as number | undefined}
          scale={scale}
          unit={unit}
          hint={hint}
          onChange={field.onChange}
          onBlur={field.onBlur}
          error={error(s(path))}
        />
      )}
    />
  );
  const minutes = (path: string, label: string) => (
    <TextField
      label={`${label} (min)`}
      type="number"
      step="any"
      min={0}
      inputMode="decimal"
      {...register(s(`design.labourMinutes.${path}`) as never, { setValueAs: (v: unknown) => (v === '' ? Number.NaN : Number(v)) })}
      error={error(s(`design.labourMinutes.${path}`))}
    />
  );

  return (
    <form noValidate onSubmit={submit} aria-label="Firm settings" className="flex flex-col gap-6">
      <FormMessage tone="info" title="Changes apply to new quotes">
        New quotes, and new revisions of existing ones, take these settings when they are made. Revisions already made,
        sent quotes above all, keep the prices, terms and design limits they were made with.
      </FormMessage>

      <Card title="The firm" description="How the firm appears on quotes, e-mails and the customer’s page.">
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="Firm name" {...register('settings.name')} error={error('settings.name')} />
          <TextField
            label="E-mail sender name"
            placeholder={base.settings.name}
            hint="Shown as who quote e-mails are from; blank uses the firm name."
            {...register('settings.emailSenderName')}
            error={error('settings.emailSenderName')}
          />
          <TextAreaField label="Address" rows={4} {...register('settings.addressLines')} error={error('settings.addressLines')} />
          <TextField label="VAT number" spellCheck={false} placeholder="GB 123 4567 89" {...register('settings.vatNumber')} error={error('settings.vatNumber')} />
        </div>
        <LogoPanel
          logo={initial.logo}
          onChanged={(answer) => {
            // the logo moves the firm's version: follow it unless someone else changed the settings meanwhile
            if (JSON.stringify(answer.settings) !== JSON.stringify(base.settings)) return;
            setBase(answer);
            form.setValue('version', answer.version);
          }}
        />
      </Card>

      <Card title="Prices and VAT" description="The defaults a new quote starts with; each quote can still change its own.">
        <div className="grid gap-4 sm:grid-cols-3">
          <SelectField label="Currency" options={FIRM_CURRENCIES.map((c) => ({ value: c, label: c }))} {...register('settings.currency')} error={error('settings.currency')} />
          <SelectField
            label="Number and date format"
            options={FIRM_LOCALES.map((l) => ({ value: l, label: LOCALE_LABELS[l] }))}
            {...register('settings.locale')}
            error={error('settings.locale')}
          />
          <TextField
            label="Quote valid for (days)"
            type="number"
            min={1}
            max={365}
            {...register('settings.quoteValidityDays', { setValueAs: (v: unknown) => (v === '' ? Number.NaN : Number(v)) })}
            error={error('settings.quoteValidityDays')}
          />
          {scaled('markupPercentBp', 'Default markup', 100, '%', 'On cost, for lines without a list price.')}
          {scaled('depositPercentBp', 'Default deposit', 100, '%')}
          {scaled('labourRateMinorPerHour', 'Labour rate', 100, `${base.settings.currency} per hour`)}
          {scaled('vatRateBp', 'Standard VAT rate', 100, '%')}
          <Controller
            control={control}
            name="settings.vatRatesBp"
            render={({ field }) => <VatRatesField value={field.value} onChange={field.onChange} onBlur={field.onBlur} error={error('settings.vatRatesBp') ?? error('settings.vatRatesBp.0')} />}
          />
          <SelectField
            label="VAT rounding"
            options={VAT_ROUNDINGS.map((r) => ({ value: r, label: VAT_ROUNDING_LABELS[r] }))}
            {...register('settings.vatRounding')}
            error={error('settings.vatRounding')}
          />
        </div>
      </Card>

      <Card title="Terms" description="Printed on every new quote and shown to the customer before they approve.">
        <TextAreaField label="Terms and conditions" rows={8} {...register('settings.termsText')} error={error('settings.termsText')} />
      </Card>

      <Card
        title="Circuit design"
        description="The limits the circuit checks use and the times the labour lines are worked out from. The checks are a design aid: mains work, RCDs, isolation and certification follow local wiring rules and a licensed electrician."
      >
        <div className="grid gap-4 sm:grid-cols-3">
          <SelectField label="Wiring rules" options={CODE_PROFILES} {...register('settings.design.codeProfile')} error={error('settings.design.codeProfile')} />
          {scaled('design.voltageDropLimitBp', 'Voltage-drop limit', 100, '% of nominal')}
          {scaled('design.driverHeadroomBp', 'Driver headroom', 100, '%', 'Power a driver or supply keeps in hand above the load.')}
          {scaled('design.cableSlackBp', 'Cable slack', 100, '%', 'Added to measured runs.')}
          {scaled('design.cableCutLengthMm', 'Cable cut length', 1000, 'm', 'Cable is bought in whole multiples of this.')}
        </div>
        <fieldset className="mt-6 grid gap-4 sm:grid-cols-3">
          <legend className="mb-3 text-caption font-semibold tracking-wide text-lamp-700 uppercase">Labour times</legend>
          {minutes('minutesPerFitting', 'Per fitting')}
          {minutes('minutesPerDriver', 'Per driver or supply')}
          {minutes('minutesPerConnectorBlock', 'Per connector block')}
          {minutes('minutesPerCircuitTest', 'Testing a circuit')}
          {CABLE_METHODS.map((m) => (
            <div key={m}>{minutes(`minutesPerMetre.${m}`, `Per metre, ${CABLE_METHOD_LABELS[m].toLowerCase()}`)}</div>
          ))}
        </fieldset>
        <fieldset className="mt-6 grid gap-4 sm:grid-cols-4">
          <legend className="mb-1 text-caption font-semibold tracking-wide text-lamp-700 uppercase">Minimum IP code by location</legend>
          <p className="mb-2 text-caption text-ink-muted sm:col-span-4">Leave a location blank to use the usual minimum shown in it.</p>
          {INSTALLATION_LOCATIONS.map((loc) => (
            <TextField
              key={loc}
              label={INSTALLATION_LOCATION_LABELS[loc]}
              placeholder={DEFAULT_MINIMUM_IP[loc]}
              spellCheck={false}
              autoComplete="off"
              {...register(`settings.design.ipMinimums.${loc}` as never)}
              error={error(`settings.design.ipMinimums.${loc}`)}
            />
          ))}
        </fieldset>
      </Card>

      <div className="sticky bottom-0 -mx-2 flex flex-col gap-2 rounded-card bg-surface/95 px-4 pt-4 pb-2 shadow-card ring-1 ring-line backdrop-blur">
        <FormMessage tone="error" title={message?.title}>
          {message ? (
            <>
              {message.stale
                ? 'Another owner saved the settings after you opened this page, so yours were not saved. Load theirs (your changes here are dropped), then make your changes again.'
                : message.detail}
              {message.stale ? (
                <Button variant="secondary" className="mt-2 h-9" onClick={onReload}>
                  Load the newer settings
                </Button>
              ) : null}
            </>
          ) : null}
        </FormMessage>
        <FormMessage tone="success" title="Settings saved">
          {saved && !formState.isDirty ? 'New quotes will use them.' : null}
        </FormMessage>
        <div className="flex items-center gap-4 pb-2">
          <Button type="submit" busy={save.isPending}>
            Save settings
          </Button>
          <span className="text-caption text-ink-muted">{formState.isDirty ? 'Unsaved changes' : 'All changes saved'}</span>
        </div>
      </div>
    </form>
  );
}

function VatRatesField({
  value,
  onChange,
  onBlur,
  error,
}: {
  value: readonly number[];
  onChange: (v: number[]) => void;
  onBlur: () => void;
  error?: string | undefined;
}) {
  const [text, setText] = useState(() => ratesToDisplay(value));
  return (
    <TextField
      label="VAT rates in use (%)"
      hint="Every rate your lines may carry, the standard one included: 20, 5, 0"
      name="settings.vatRatesBp"
      inputMode="decimal"
      autoComplete="off"
      value={text}
      onChange={(e) => {
        setText(e.target.value);
        onChange(ratesFromDisplay(e.target.value));
      }}
      onBlur={onBlur}
      error={error}
    />
  );
}
