'use client';

import Form from 'next/form';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';

type Props = { action: string; date: string | null; error?: string | undefined };

/** A plain GET form: the date lives in the URL, so a sheet for a given day can be bookmarked and shared. */
export function ShootDateForm({ action, date, error }: Props) {
  return (
    <Form action={action} className="flex flex-wrap items-start gap-2 print:hidden">
      {/* Keyed on the date so the field follows the URL after a soft navigation. */}
      <TextField key={date ?? ''} label="Shoot date" name="date" type="date" defaultValue={date ?? ''} error={error} className="w-44" />
      <Button type="submit" variant="secondary" className="mt-6">
        Show
      </Button>
    </Form>
  );
}
