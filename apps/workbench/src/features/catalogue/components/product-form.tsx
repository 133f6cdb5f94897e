import { zodResolver } from '@hookform/resolvers/zod';
import {
  DIMMING_METHODS,
  PRODUCT_KIND_LABELS,
  ProductInput,
  type Product,
  type ProductInputParsed,
  type ProductKind,
} from '@gloaming/contracts';
import { useState } from 'react';
import { Controller, get, useForm, useWatch, type Resolver } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { FormMessage } from '../../../components/ui/form-message';
import { SelectField } from '../../../components/ui/select-field';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { TextField } from '../../../components/ui/text-field';
import { applyServerErrors } from '../../../lib/server-field-errors';
import { useCreateProduct, useDeactivateProduct, useUpdateProduct } from '../api/save-product';
import { MoneyField } from './money-field';

type Values = ProductInput;

/** Empty number inputs are "not given", not zero. */
const asNumber = { setValueAs: (v: unknown) => (v === '' || v === null || v === undefined ? undefined : Number(v)) };

type Loose = Record<string, unknown>;
const isBlank = (o: unknown): boolean => typeof o === 'object' && o !== null && Object.values(o).every((v) => v === undefined || v === '' || (typeof v === 'object' && isBlank(v)));

/** Drop optional groups left entirely empty (a second rating, a tail, a power window). */
function pruneOptional(values: Values): Values {
  const spec = { ...(values.spec as Loose) };
  if (Array.isArray(spec.ratings)) spec.ratings = (spec.ratings as Loose[]).filter((r, i) => i === 0 || !isBlank(r));
  const tail = spec.tail as Loose | undefined;
  if (tail && tail.lengthM === undefined && (tail.conductor as Loose | undefined)?.areaMm2 === undefined) delete spec.tail;
  if (spec.powerWindowW && isBlank(spec.powerWindowW)) delete spec.powerWindowW;
  return { ...values, spec } as Values;
}

const resolver: Resolver<Values, unknown, ProductInputParsed> = (values, context, options) =>
  zodResolver(ProductInput)(pruneOptional(values), context, options as never) as ReturnType<Resolver<Values, unknown, ProductInputParsed>>;

const EMPTY_SPEC: Record<ProductKind, Loose> = {
  fitting: { driveMode: 'constant-current', ratings: [{}, {}], ipCode: '' },
  driver: { voltageWindowV: {}, dimming: 'none', ipCode: '' },
  'cv-supply': { ipCode: '' },
  cable: { conductor: { kind: 'metric', conductorClass: 5, coating: 'plain' } },
  'connector-block': { ipCode: '' },
  accessory: {},
  labour: {},
};

function startingValues(kind: ProductKind, product?: Product): Values {
  if (product) {
    const { id: _id, createdAt: _c, updatedAt: _u, version: _v, ...rest } = product;
    const spec = rest.kind === 'fitting' && rest.spec.driveMode === 'constant-current' ? { ...rest.spec, ratings: [...rest.spec.ratings, {}] } : rest.spec;
    return { ...rest, spec } as Values;
  }
  return { kind, supplier: '', supplierCode: '', name: '', description: '', unit: kind === 'cable' ? 'm' : kind === 'labour' ? 'job' : 'each', active: true, spec: EMPTY_SPEC[kind] } as unknown as Values;
}

/** Create or edit one product: the common fields, then the spec fields of its kind. */
export function ProductForm({ kind, product, onDone }: { kind: ProductKind; product?: Product; onDone: () => void }) {
  const create = useCreateProduct();
  const update = useUpdateProduct();
  const deactivate = useDeactivateProduct();
  const [message, setMessage] = useState<{ title: string; detail: string } | undefined>();
  const form = useForm<Values, unknown, ProductInputParsed>({ resolver, defaultValues: startingValues(kind, product) });
  const { register, control, formState } = form;
  const error = (path: string): string | undefined => (get(formState.errors, path) as { message?: string } | undefined)?.message;
  const driveMode = useWatch({ control, name: 'spec.driveMode' as never }) as string | undefined;
  const conductorKind = useWatch({ control, name: 'spec.conductor.kind' as never }) as string | undefined;

  const onError = (err: unknown) => setMessage(applyServerErrors(err, form.setError, () => true));
  const submit = form.handleSubmit((input) => {
    setMessage(undefined);
    if (product) update.mutate({ id: product.id, input: { ...input, version: product.version } }, { onSuccess: onDone, onError });
    else create.mutate(input, { onSuccess: onDone, onError });
  });

  const num = (name: string, label: string, extra: { step?: string; hint?: string } = {}) => (
    <TextField label={label} type="number" step={extra.step ?? 'any'} hint={extra.hint} {...register(name as never, asNumber)} error={error(name)} />
  );
  const ip = () => <TextField label="IP code" placeholder="IP67" spellCheck={false} {...register('spec.ipCode' as never)} error={error('spec.ipCode')} />;

  return (
    <form noValidate onSubmit={submit} aria-label={product ? `Edit ${product.name}` : `New in ${PRODUCT_KIND_LABELS[kind]}`} className="grid gap-5">
      <FormMessage tone="error" title={message?.title}>
        {message?.detail}
      </FormMessage>
      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-3 text-caption font-semibold tracking-wide text-lamp-700 uppercase">{PRODUCT_KIND_LABELS[kind]}</legend>
        <TextField label="Name" {...register('name')} error={error('name')} className="sm:col-span-2" />
        <TextField label="Supplier" {...register('supplier')} error={error('supplier')} />
        <TextField label="Supplier code" spellCheck={false} {...register('supplierCode')} error={error('supplierCode')} />
        <Controller
          control={control}
          name="costMinor"
          render={({ field }) => <MoneyField label="Cost (£)" name={field.name} value={field.value} onChange={field.onChange} onBlur={field.onBlur} error={error('costMinor')} />}
        />
        <Controller
          control={control}
          name="listPriceMinor"
          render={({ field }) => <MoneyField label="List price (£)" name={field.name} value={field.value} onChange={field.onChange} onBlur={field.onBlur} error={error('listPriceMinor')} />}
        />
        <TextField label="Unit" placeholder="each, m, hour" {...register('unit')} error={error('unit')} />
        <label className="flex items-center gap-2 self-end pb-3 text-body">
          <input type="checkbox" className="size-4 accent-lamp-500" {...register('active')} />
          In use (offered in the product picker)
        </label>
        <TextAreaField label="Description" {...register('description')} error={error('description')} className="sm:col-span-2" />
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-3 text-caption font-semibold tracking-wide text-lamp-700 uppercase">Specification</legend>
        {kind === 'fitting' ? (
          <>
            <SelectField
              label="Drive"
              options={[
                { value: 'constant-current', label: 'Constant current (series)' },
                { value: 'constant-voltage', label: 'Constant voltage (parallel)' },
              ]}
              {...register('spec.driveMode' as never)}
              error={error('spec.driveMode')}
            />
            {ip()}
            {num('spec.lumens', 'Light output, lm')}
            {driveMode === 'constant-voltage' ? (
              <>
                {num('spec.nominalVoltageV', 'Nominal voltage, V')}
                {num('spec.powerW', 'Power, W')}
              </>
            ) : (
              [0, 1].map((i) => (
                <div key={i} className="grid gap-4 sm:col-span-3 sm:grid-cols-3">
                  {num(`spec.ratings.${i}.currentA`, `Rating ${i + 1}: current, A`, { hint: i === 0 ? 'e.g. 0.35, 0.5, 0.7' : 'optional' })}
                  {num(`spec.ratings.${i}.forwardVoltageV`, 'Forward voltage, V')}
                  {num(`spec.ratings.${i}.powerW`, 'or power, W')}
                </div>
              ))
            )}
            {num('spec.beamAngleDeg', 'Beam angle, °')}
            {num('spec.colourTemperatureK', 'Colour temperature, K', { step: '1' })}
            <span />
            {num('spec.tail.lengthM', 'Tail length, m')}
            {num('spec.tail.conductor.areaMm2', 'Tail conductor, mm²')}
          </>
        ) : null}
        {kind === 'driver' ? (
          <>
            {num('spec.currentA', 'Output current, A')}
            {num('spec.voltageWindowV.minV', 'Lowest output voltage, V')}
            {num('spec.voltageWindowV.maxV', 'Highest output voltage, V')}
            {num('spec.powerWindowW.minW', 'Lowest power, W')}
            {num('spec.powerWindowW.maxW', 'Highest power, W')}
            {num('spec.maxPowerW', 'Maximum power, W')}
            {num('spec.efficiencyPct', 'Efficiency, %')}
            {ip()}
            <SelectField label="Dimming" options={DIMMING_METHODS.map((d) => ({ value: d, label: d }))} {...register('spec.dimming' as never)} error={error('spec.dimming')} />
          </>
        ) : null}
        {kind === 'cv-supply' ? (
          <>
            {num('spec.outputVoltageV', 'Output voltage, V')}
            {num('spec.ratedPowerW', 'Rated power, W')}
            {ip()}
          </>
        ) : null}
        {kind === 'cable' ? (
          <>
            {num('spec.cores', 'Cores', { step: '1' })}
            <SelectField
              label="Conductor size in"
              options={[
                { value: 'metric', label: 'mm² (IEC 60228)' },
                { value: 'awg', label: 'AWG' },
              ]}
              {...register('spec.conductor.kind' as never)}
            />
            {conductorKind === 'awg' ? (
              num('spec.conductor.gauge', 'Gauge, AWG', { step: '1' })
            ) : (
              <>
                {num('spec.conductor.areaMm2', 'Cross-section, mm²')}
                <SelectField
                  label="Conductor class"
                  options={[
                    { value: '1', label: 'Class 1 (solid)' },
                    { value: '2', label: 'Class 2 (stranded)' },
                    { value: '5', label: 'Class 5 (flexible)' },
                  ]}
                  {...register('spec.conductor.conductorClass' as never, asNumber)}
                  error={error('spec.conductor.conductorClass')}
                />
              </>
            )}
            {num('spec.statedOhmPerKm', 'Stated resistance, Ω/km', { hint: 'Only when the supplier states it' })}
            {num('spec.cutLengthM', 'Cut length, m', { hint: 'Drum or coil length, if sold that way' })}
          </>
        ) : null}
        {kind === 'connector-block' ? (
          <>
            {num('spec.terminals', 'Terminals', { step: '1' })}
            {num('spec.entries', 'Cable entries', { step: '1' })}
            {num('spec.conductorsPerTerminal', 'Conductors per terminal', { step: '1' })}
            {ip()}
          </>
        ) : null}
        {kind === 'labour' ? (
          <>
            {num('spec.minutes', 'Minutes per unit', { step: '1' })}
            <Controller
              control={control}
              name={'spec.rateMinorPerHour' as never}
              render={({ field }) => (
                <MoneyField label="Rate per hour (£, blank for the firm's rate)" name={field.name} value={field.value as number | undefined} onChange={field.onChange} onBlur={field.onBlur} error={error('spec.rateMinorPerHour')} />
              )}
            />
          </>
        ) : null}
        {kind === 'accessory' ? <p className="text-caption text-ink-muted sm:col-span-3">Sundries need no electrical data.</p> : null}
      </fieldset>

      <div className="flex flex-wrap gap-3">
        <Button type="submit" busy={create.isPending || update.isPending}>
          {product ? 'Save changes' : 'Add to catalogue'}
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
        {product?.active ? (
          <Button variant="quiet" busy={deactivate.isPending} onClick={() => deactivate.mutate({ id: product.id, input: { version: product.version } }, { onSuccess: onDone, onError })}>
            Take out of use
          </Button>
        ) : null}
      </div>
    </form>
  );
}
