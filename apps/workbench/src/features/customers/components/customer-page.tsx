import { zodResolver } from '@hookform/resolvers/zod';
import { CustomerUpdate, SiteInput, SiteUpdate, type Customer, type CustomerSite } from '@gloaming/contracts';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link, useParams } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { FormMessage } from '../../../components/ui/form-message';
import { PageHeader } from '../../../components/ui/page-header';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { TextField } from '../../../components/ui/text-field';
import { applyServerErrors } from '../../../lib/server-field-errors';
import { useCustomer } from '../api/get-customer';
import { useAddSite, useRemoveSite, useUpdateSite } from '../api/site-changes';
import { useUpdateCustomer } from '../api/update-customer';

type Message = { title: string; detail: string } | undefined;

export function CustomerPage() {
  const { customerId = '' } = useParams();
  const customer = useCustomer(customerId);
  if (customer.isPending) return <p role="status">Loading the customer…</p>;
  if (customer.isError)
    return (
      <FormMessage tone="error" title="This customer could not be loaded">
        {customer.error.message}
      </FormMessage>
    );
  return <CustomerEditor key={customer.data.id} customer={customer.data} />;
}

function CustomerEditor({ customer }: { customer: Customer }) {
  const update = useUpdateCustomer();
  const [message, setMessage] = useState<Message>();
  const [saved, setSaved] = useState(false);
  const valuesOf = (c: Customer) => ({ name: c.name, email: c.email ?? '', phone: c.phone ?? '', notes: c.notes, version: c.version });
  const form = useForm({ resolver: zodResolver(CustomerUpdate), defaultValues: valuesOf(customer) });
  const errors = form.formState.errors;
  const submit = form.handleSubmit((input) => {
    setMessage(undefined);
    setSaved(false);
    update.mutate(
      { id: customer.id, input },
      {
        onSuccess: (updated) => {
          // the next edit is based on the version just saved
          form.reset(valuesOf(updated));
          setSaved(true);
        },
        onError: (error) => setMessage(applyServerErrors(error, form.setError, (p) => ['name', 'email', 'phone', 'notes'].includes(p))),
      },
    );
  });
  return (
    <>
      <title>{`${customer.name} · Customers · Gloaming`}</title>
      <PageHeader eyebrow="Customers" title={customer.name}>
        <Link to="/customers" className="font-semibold text-dusk-700 hover:underline">
          ← All customers
        </Link>
      </PageHeader>
      <div className="grid items-start gap-6 xl:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <Card title="Details">
          <form noValidate onSubmit={submit} aria-label="Customer details" className="grid gap-4">
            <FormMessage tone="error" title={message?.title}>
              {message?.detail}
            </FormMessage>
            <FormMessage tone="success">{saved ? 'Saved.' : null}</FormMessage>
            <TextField label="Name" {...form.register('name')} error={errors.name?.message} />
            <TextField label="E-mail" type="email" spellCheck={false} {...form.register('email')} error={errors.email?.message} />
            <TextField label="Phone" type="tel" {...form.register('phone')} error={errors.phone?.message} />
            <TextAreaField label="Notes" {...form.register('notes')} error={errors.notes?.message} />
            <Button type="submit" busy={update.isPending} className="justify-self-start">
              Save details
            </Button>
          </form>
        </Card>
        <div className="grid gap-6">
          {customer.sites.map((site) => (
            <SiteEditor key={`${site.id}-${site.version}`} customerId={customer.id} site={site} canRemove={customer.sites.length > 1} />
          ))}
          <NewSiteForm customerId={customer.id} />
        </div>
      </div>
    </>
  );
}

const SITE_FIELDS = ['label', 'addressLines', 'postcode', 'accessNotes'];

function SiteEditor({ customerId, site, canRemove }: { customerId: string; site: CustomerSite; canRemove: boolean }) {
  const update = useUpdateSite();
  const remove = useRemoveSite();
  const [message, setMessage] = useState<Message>();
  const form = useForm({
    resolver: zodResolver(SiteUpdate),
    defaultValues: { label: site.label, addressLines: site.addressLines, postcode: site.postcode, accessNotes: site.accessNotes, version: site.version },
  });
  const errors = form.formState.errors;
  const submit = form.handleSubmit((input) =>
    update.mutate({ customerId, siteId: site.id, input }, { onError: (error) => setMessage(applyServerErrors(error, form.setError, (p) => SITE_FIELDS.includes(p))) }),
  );
  return (
    <Card
      title={site.label || 'Site'}
      description={site.postcode || undefined}
      actions={
        canRemove ? (
          <Button
            variant="quiet"
            busy={remove.isPending}
            onClick={() => remove.mutate({ customerId, siteId: site.id }, { onError: (error) => setMessage(applyServerErrors(error, form.setError, () => false)) })}
          >
            Remove
          </Button>
        ) : undefined
      }
    >
      <form noValidate onSubmit={submit} aria-label={`Site ${site.label || site.postcode}`} className="grid gap-4">
        <FormMessage tone="error" title={message?.title}>
          {message?.detail}
        </FormMessage>
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="Label" {...form.register('label')} error={errors.label?.message} />
          <TextField label="Postcode" {...form.register('postcode')} error={errors.postcode?.message} />
          <TextAreaField label="Address" {...form.register('addressLines')} error={errors.addressLines?.message} />
          <TextAreaField label="Access notes" {...form.register('accessNotes')} error={errors.accessNotes?.message} />
        </div>
        <Button type="submit" variant="secondary" busy={update.isPending} className="justify-self-start">
          Save site
        </Button>
      </form>
    </Card>
  );
}

function NewSiteForm({ customerId }: { customerId: string }) {
  const add = useAddSite();
  const [message, setMessage] = useState<Message>();
  const form = useForm({ resolver: zodResolver(SiteInput), defaultValues: { label: '', addressLines: '', postcode: '', accessNotes: '' } });
  const errors = form.formState.errors;
  const submit = form.handleSubmit((input) =>
    add.mutate(
      { customerId, input },
      { onSuccess: () => form.reset(), onError: (error) => setMessage(applyServerErrors(error, form.setError, (p) => SITE_FIELDS.includes(p))) },
    ),
  );
  return (
    <Card title="Add a site" description="Another property for the same customer.">
      <form noValidate onSubmit={submit} aria-label="Add a site" className="grid gap-4">
        <FormMessage tone="error" title={message?.title}>
          {message?.detail}
        </FormMessage>
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="Label" {...form.register('label')} error={errors.label?.message} />
          <TextField label="Postcode" {...form.register('postcode')} error={errors.postcode?.message} />
          <TextAreaField label="Address" {...form.register('addressLines')} error={errors.addressLines?.message} />
          <TextAreaField label="Access notes" {...form.register('accessNotes')} error={errors.accessNotes?.message} />
        </div>
        <Button type="submit" variant="secondary" busy={add.isPending} className="justify-self-start">
          Add site
        </Button>
      </form>
    </Card>
  );
}
