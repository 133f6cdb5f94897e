import {
  IMPORT_FIELD_INFO,
  IMPORT_FIELDS,
  PRODUCT_KIND_LABELS,
  PRODUCT_KINDS,
  ProductKind,
  type ColumnMapping,
  type ImportField,
  type ImportJob,
  type PreviewResponse,
  type PriceListUploadResponse,
} from '@gloaming/contracts';
import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { FormMessage } from '../../../components/ui/form-message';
import { PageHeader } from '../../../components/ui/page-header';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { fromRequestError, type FormErrors } from '../../../lib/form-errors';
import { useSignedInUser } from '../../session/hooks/use-signed-in-user';
import { rejectionsCsvUrl, useImportJob, usePreviewImport, useRunImport, useUploadPriceList } from '../api/price-list-import';

const STEPS = ['Upload', 'Match columns', 'Check rows', 'Import', 'Result'] as const;

/** Upload -> map columns -> preview with row errors -> import with a progress bar -> result. */
export function ImportWizard() {
  const user = useSignedInUser();
  const [upload, setUpload] = useState<PriceListUploadResponse | null>(null);
  const [mapping, setMapping] = useState<ColumnMapping | null>(null);
  const [preview, setPreview] = useState<PreviewResponse | null>(null);
  const [jobId, setJobId] = useState<string | undefined>();
  const job = useImportJob(jobId);
  const finished = job.data && (job.data.state === 'done' || job.data.state === 'failed');
  const step = finished ? 4 : jobId ? 3 : preview ? 2 : upload ? 1 : 0;

  return (
    <>
      <title>{`Import a price list · ${user.organization.name} · Gloaming`}</title>
      <PageHeader eyebrow="Catalogue" title="Import a price list">
        A supplier’s CSV file: new codes are added, known codes are updated, rows with problems are set aside with the reason.
      </PageHeader>
      <ol aria-label="Import steps" className="mb-6 grid gap-2 sm:grid-cols-5">
        {STEPS.map((name, index) => (
          <li
            key={name}
            aria-current={index === step ? 'step' : undefined}
            className={`rounded-control px-3 py-2 text-caption ring-1 ${
              index === step ? 'bg-lamp-50 font-semibold text-ink ring-lamp-300' : index < step ? 'bg-surface text-leaf-700 ring-line' : 'bg-surface text-ink-muted ring-line'
            }`}
          >
            <span className="font-mono text-micro">{String(index + 1).padStart(2, '0')}</span> {name}
          </li>
        ))}
      </ol>
      {step === 0 ? <UploadStep onUploaded={(u) => { setUpload(u); setMapping(u.suggestedMapping); }} /> : null}
      {step === 1 && upload && mapping ? <MappingStep upload={upload} mapping={mapping} onChange={setMapping} onPreview={setPreview} /> : null}
      {step === 2 && upload && mapping && preview ? (
        <PreviewStep upload={upload} mapping={mapping} preview={preview} onBack={() => setPreview(null)} onStarted={(j) => setJobId(j.id)} />
      ) : null}
      {step === 3 ? <ProgressStep job={job.data} /> : null}
      {step === 4 && job.data ? <ResultStep job={job.data} /> : null}
    </>
  );
}

function UploadStep({ onUploaded }: { onUploaded: (u: PriceListUploadResponse) => void }) {
  const uploadFile = useUploadPriceList();
  const [errors, setErrors] = useState<FormErrors<'supplier' | 'file'>>({ fields: {} });
  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const supplier = String(data.get('supplier') ?? '').trim();
    const file = data.get('file');
    const fields: FormErrors<'supplier' | 'file'>['fields'] = {};
    if (!supplier) fields.supplier = 'Enter the supplier this price list comes from.';
    if (!(file instanceof File) || file.size === 0) fields.file = 'Choose a CSV file.';
    setErrors({ fields });
    if (fields.supplier || fields.file || !(file instanceof File)) return;
    uploadFile.mutate({ supplier, file }, { onSuccess: onUploaded, onError: (error) => setErrors(fromRequestError(error, ['supplier', 'file'] as const, { 413: 'File too large' })) });
  }
  return (
    <Card title="Choose the file" description="CSV from any spreadsheet: comma, semicolon or tab separated, in UTF-8 or an older Western encoding.">
      <form noValidate onSubmit={submit} aria-label="Upload a price list" className="grid max-w-measure gap-4">
        <FormMessage tone="error" title={errors.form?.title}>
          {errors.form?.detail}
        </FormMessage>
        <TextField label="Supplier" name="supplier" autoComplete="off" hint="Column choices are remembered for each supplier." error={errors.fields.supplier} />
        <TextField label="Price list (CSV)" name="file" type="file" accept=".csv,text/csv,text/plain" error={errors.fields.file} className="[&_input]:pt-2.5" />
        <Button type="submit" busy={uploadFile.isPending} className="justify-self-start">
          Upload and read columns
        </Button>
      </form>
    </Card>
  );
}

function fieldsFor(kind: ProductKind): ImportField[] {
  return IMPORT_FIELDS.filter((f) => {
    const kinds = IMPORT_FIELD_INFO[f].kinds;
    return kinds === 'all' || (kinds as readonly string[]).includes(kind);
  });
}

function MappingStep({
  upload,
  mapping,
  onChange,
  onPreview,
}: {
  upload: PriceListUploadResponse;
  mapping: ColumnMapping;
  onChange: (m: ColumnMapping) => void;
  onPreview: (p: PreviewResponse) => void;
}) {
  const previewRows = usePreviewImport();
  const [message, setMessage] = useState<{ title: string; detail: string } | undefined>();
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const options = [{ value: '', label: '— not in this file —' }, ...upload.headers.map((h) => ({ value: h, label: h }))];
  function check() {
    setMessage(undefined);
    setFieldErrors({});
    previewRows.mutate(
      { jobId: upload.job.id, mapping },
      {
        onSuccess: onPreview,
        onError: (error) => {
          const result = fromRequestError(error, IMPORT_FIELDS);
          setFieldErrors(result.fields as Record<string, string>);
          setMessage(result.form ?? { title: 'Some columns need attention', detail: 'See the marked fields.' });
        },
      },
    );
  }
  return (
    <div className="grid gap-6">
      <Card
        title={`${upload.job.fileName}: ${upload.job.totalRows} rows`}
        description={`Read as ${upload.encoding}, columns separated by ${upload.delimiter === '\t' ? 'tabs' : `“${upload.delimiter}”`}.${upload.mappingRemembered ? ` Column choices from the last ${upload.job.supplier} import are filled in.` : ''}`}
      >
        <div className="overflow-x-auto">
          <table className="w-full text-left text-caption">
            <caption className="sr-only">The first rows of the file</caption>
            <thead>
              <tr className="border-b border-line text-ink-muted">
                {upload.headers.map((h) => (
                  <th key={h} scope="col" className="px-2 py-1.5 font-semibold whitespace-nowrap">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {upload.sampleRows.map((row, i) => (
                <tr key={i} className="border-b border-line last:border-0">
                  {upload.headers.map((h, j) => (
                    <td key={h} className="px-2 py-1.5 font-mono whitespace-nowrap">
                      {row[j] ?? ''}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </Card>
      <Card title="Match the columns" description="Tell Gloaming which column holds each field. Supplier code and name are needed; the rest as the file has them.">
        <FormMessage tone="error" title={message?.title}>
          {message?.detail}
        </FormMessage>
        <div className="grid gap-4 sm:grid-cols-3">
          <SelectField
            label="Kind of product, where the file has no kind column"
            options={PRODUCT_KINDS.map((k) => ({ value: k, label: PRODUCT_KIND_LABELS[k] }))}
            value={mapping.defaultKind}
            onChange={(e) => {
              const kind = ProductKind.safeParse(e.target.value);
              if (kind.success) onChange({ ...mapping, defaultKind: kind.data });
            }}
            className="sm:col-span-3"
          />
          {fieldsFor(mapping.defaultKind).map((field) => (
            <SelectField
              key={field}
              label={IMPORT_FIELD_INFO[field].label}
              options={options}
              value={mapping.columns[field] ?? ''}
              error={fieldErrors[field]}
              onChange={(e) => {
                const columns = { ...mapping.columns };
                if (e.target.value) columns[field] = e.target.value;
                else delete columns[field];
                onChange({ ...mapping, columns });
              }}
            />
          ))}
        </div>
        <Button className="mt-6" busy={previewRows.isPending} onClick={check}>
          Check the first rows
        </Button>
      </Card>
    </div>
  );
}

const OUTCOME: Record<'create' | 'update' | 'reject', { label: string; tone: 'positive' | 'neutral' | 'pending' }> = {
  create: { label: 'New', tone: 'positive' },
  update: { label: 'Update', tone: 'neutral' },
  reject: { label: 'Set aside', tone: 'pending' },
};

function PreviewStep({
  upload,
  mapping,
  preview,
  onBack,
  onStarted,
}: {
  upload: PriceListUploadResponse;
  mapping: ColumnMapping;
  preview: PreviewResponse;
  onBack: () => void;
  onStarted: (job: ImportJob) => void;
}) {
  const run = useRunImport();
  const [message, setMessage] = useState<{ title: string; detail: string } | undefined>();
  const rejected = preview.rows.filter((r) => r.outcome === 'reject').length;
  return (
    <Card
      title={`The first ${preview.rows.length} of ${preview.totalRows} rows`}
      description={rejected ? `${rejected} of these would be set aside; the rest import. Fix the file, or import and download the set-aside rows afterwards.` : 'Every row shown reads cleanly.'}
    >
      <FormMessage tone="error" title={message?.title}>
        {message?.detail}
      </FormMessage>
      <div className="overflow-x-auto">
        <table className="w-full text-left text-body" data-testid="import-preview">
          <caption className="sr-only">Rows checked before importing</caption>
          <thead>
            <tr className="border-b border-line text-caption text-ink-muted">
              <th scope="col" className="py-2 pr-3 font-semibold">Row</th>
              <th scope="col" className="py-2 pr-3 font-semibold">Code</th>
              <th scope="col" className="py-2 pr-3 font-semibold">Name</th>
              <th scope="col" className="py-2 pr-3 font-semibold">Outcome</th>
            </tr>
          </thead>
          <tbody>
            {preview.rows.map((row) => (
              <tr key={row.row} className="border-b border-line align-top last:border-0">
                <td className="py-2 pr-3 font-mono text-caption">{row.row}</td>
                <td className="py-2 pr-3 font-mono text-caption">{row.supplierCode}</td>
                <td className="py-2 pr-3">{row.name}</td>
                <td className="py-2 pr-3">
                  <Badge tone={OUTCOME[row.outcome].tone}>{OUTCOME[row.outcome].label}</Badge>
                  {row.errors.map((e) => (
                    <p key={e.path} className="mt-1 text-caption text-ember-700">
                      {e.message}
                    </p>
                  ))}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="mt-6 flex gap-3">
        <Button
          busy={run.isPending}
          onClick={() =>
            run.mutate(
              { jobId: upload.job.id, mapping },
              { onSuccess: onStarted, onError: (error) => setMessage(fromRequestError(error, [] as const).form) },
            )
          }
        >
          Import all {preview.totalRows} rows
        </Button>
        <Button variant="secondary" onClick={onBack}>
          Back to the columns
        </Button>
      </div>
    </Card>
  );
}

function ProgressStep({ job }: { job: ImportJob | undefined }) {
  const total = job?.totalRows ?? 0;
  const done = job?.processedRows ?? 0;
  const percent = total ? Math.round((done / total) * 100) : 0;
  const writing = total > 0 && done >= total;
  return (
    <Card title="Importing" description="You can keep working in another tab; the import carries on.">
      <div
        role="progressbar"
        aria-label="Rows checked"
        aria-valuemin={0}
        aria-valuemax={total}
        aria-valuenow={done}
        aria-valuetext={writing ? 'Saving to the catalogue' : `${done} of ${total} rows checked`}
        className="h-3 overflow-hidden rounded-pill bg-mist-100 ring-1 ring-line"
      >
        <div className="h-full bg-accent transition-[width]" style={{ width: `${percent}%` }} />
      </div>
      <p className="mt-3 text-caption text-ink-muted" role="status">
        {writing ? 'All rows checked; saving them to the catalogue in one go…' : `${done.toLocaleString('en-GB')} of ${total.toLocaleString('en-GB')} rows checked`}
      </p>
    </Card>
  );
}

function ResultStep({ job }: { job: ImportJob }) {
  if (job.state === 'failed')
    return (
      <FormMessage tone="error" title="The import did not complete">
        {job.error}
      </FormMessage>
    );
  return (
    <div className="grid gap-6">
      <dl className="grid gap-4 sm:grid-cols-3" data-testid="import-result">
        <Figure label="Added" value={job.createdCount} />
        <Figure label="Updated" value={job.updatedCount} />
        <Figure label="Set aside" value={job.rejectedCount} />
      </dl>
      {job.rejectedCount > 0 ? (
        <Card
          title="Rows set aside"
          description="Nothing from these rows was imported. Download them, correct them in a spreadsheet and import that file."
          actions={
            <a href={rejectionsCsvUrl(job.id)} download className="inline-flex h-11 items-center rounded-control bg-surface px-4 font-semibold text-dusk-800 ring-1 ring-mist-300 ring-inset hover:bg-dusk-50">
              Download as CSV
            </a>
          }
        >
          <ul className="grid gap-2" data-testid="import-rejections">
            {job.rejections.map((r) => (
              <li key={r.row} className="text-body">
                <span className="font-mono text-caption text-ink-muted">Row {r.row}</span> {r.reason}
              </li>
            ))}
          </ul>
        </Card>
      ) : null}
      <div className="flex gap-3">
        <Link to="/catalogue" className="inline-flex h-11 items-center rounded-control bg-accent px-5 font-semibold text-accent-ink shadow-control hover:bg-lamp-300">
          Open the catalogue
        </Link>
        <Link to="/catalogue/import" reloadDocument className="inline-flex h-11 items-center px-3 font-semibold text-dusk-700 hover:underline">
          Import another file
        </Link>
      </div>
    </div>
  );
}

function Figure({ label, value }: { label: string; value: number }) {
  return (
    <div className="rounded-card bg-surface px-5 py-4 shadow-card ring-1 ring-line">
      <dt className="text-caption text-ink-muted">{label}</dt>
      <dd className="mt-1 font-mono text-heading font-semibold text-ink">{value.toLocaleString('en-GB')}</dd>
    </div>
  );
}
