import { zodResolver } from '@hookform/resolvers/zod';
import { CustomerInput } from '@gloaming/contracts';
import { useState } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import { Link, useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { FormMessage } from '../../../components/ui/form-message';
import { PageHeader } from '../../../components/ui/page-header';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { TextField } from '../../../components/ui/text-field';
import { applyServerErrors } from '../../../lib/server-field-errors';
import { useSignedInUser } from '../../session/hooks/use-signed-in-user';
import { useCreateCustomer } from '../api/create-customer';

const EMPTY_SITE = { label: '', addressLines: '', postcode: '', accessNotes: '' };
const FIELD = /^(name|email|phone|notes|sites(\.\d+\.(label|addressLines|postcode|accessNotes))?)$/;

/** A new customer with their first site (more sites can be added here or later). */
export function NewCustomerPage() {
  const user = useSignedInUser();
  const navigate = useNavigate();
  const create = useCreateCustomer();
  const [formMessage, setFormMessage] = useState<{ title: string; detail: string } | undefined>();
  const form = useForm({
    resolver: zodResolver(CustomerInput),
    defaultValues: { name: '', email: '', phone: '', notes: '', sites: [EMPTY_SITE] },
  });
  const sites = useFieldArray({ control: form.control, name: 'sites' });
  const errors = form.formState.errors;

  const submit = form.handleSubmit((input) => {
    setFormMessage(undefined);
    create.mutate(input, {
      onSuccess: (customer) => navigate(`/customers/${customer.id}`, { replace: true }),
      onError: (error) => setFormMessage(applyServerErrors(error, form.setError, (path) => FIELD.test(path))),
    });
  });

  return (
    <>
      <title>{`New customer · ${user.organization.name} · Gloaming`}</title>
      <PageHeader eyebrow="Customers" title="New customer">
        Who the quote is for, and the address where the lighting goes.
      </PageHeader>
      <form noValidate onSubmit={submit} aria-label="New customer" className="grid gap-6">
        <FormMessage tone="error" title={formMessage?.title}>
          {formMessage?.detail}
        </FormMessage>
        <Card title="Customer">
          <div className="grid gap-4 sm:grid-cols-2">
            <TextField label="Name" autoComplete="off" autoFocus {...form.register('name')} error={errors.name?.message} className="sm:col-span-2" />
            <TextField label="E-mail" type="email" spellCheck={false} autoComplete="off" {...form.register('email')} error={errors.email?.message} />
            <TextField label="Phone" type="tel" autoComplete="off" {...form.register('phone')} error={errors.phone?.message} />
            <TextAreaField label="Notes" {...form.register('notes')} error={errors.notes?.message} className="sm:col-span-2" />
          </div>
        </Card>
        {sites.fields.map((site, index) => (
          <Card
            key={site.id}
            title={`Site ${index + 1}`}
            actions={
              sites.fields.length > 1 ? (
                <Button variant="quiet" onClick={() => sites.remove(index)}>
                  Remove site {index + 1}
                </Button>
              ) : undefined
            }
          >
            <div className="grid gap-4 sm:grid-cols-2">
              <TextField label="Label" placeholder="Home, holiday let…" {...form.register(`sites.${index}.label`)} error={errors.sites?.[index]?.label?.message} />
              <TextField label="Postcode" {...form.register(`sites.${index}.postcode`)} error={errors.sites?.[index]?.postcode?.message} />
              <TextAreaField label="Address" {...form.register(`sites.${index}.addressLines`)} error={errors.sites?.[index]?.addressLines?.message} />
              <TextAreaField label="Access notes" placeholder="Gate codes, dogs, where to park" {...form.register(`sites.${index}.accessNotes`)} error={errors.sites?.[index]?.accessNotes?.message} />
            </div>
          </Card>
        ))}
        {errors.sites?.message || errors.sites?.root?.message ? (
          <FormMessage tone="error">{errors.sites.message ?? errors.sites.root?.message}</FormMessage>
        ) : null}
        <div className="flex flex-wrap gap-3">
          <Button type="submit" busy={create.isPending}>
            Save customer
          </Button>
          <Button variant="secondary" onClick={() => sites.append(EMPTY_SITE)}>
            Add another site
          </Button>
          <Link to="/customers" className="inline-flex h-11 items-center px-3 font-semibold text-dusk-700 hover:underline">
            Cancel
          </Link>
        </div>
      </form>
    </>
  );
}
