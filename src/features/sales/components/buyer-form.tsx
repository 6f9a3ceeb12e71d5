import { useState, type FormEvent } from 'react';
import type { BuyerBody, BuyerView } from '#shared/schemas/sales';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextAreaField } from '@/components/ui/text-area-field';
import { TextField } from '@/components/ui/text-field';

/** A buyer's contact details: only the name is needed; the e-mail takes invoices. */
export function BuyerForm({
  buyer,
  busy,
  error,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  buyer?: BuyerView;
  busy: boolean;
  error: string | null;
  submitLabel: string;
  onSubmit: (body: BuyerBody) => void;
  onCancel?: () => void;
}) {
  const [name, setName] = useState(buyer?.name ?? '');
  const [email, setEmail] = useState(buyer?.email ?? '');
  const [phone, setPhone] = useState(buyer?.phone ?? '');
  const [address, setAddress] = useState(buyer?.address ?? '');
  const [notes, setNotes] = useState(buyer?.notes ?? '');
  function submit(e: FormEvent) {
    e.preventDefault();
    onSubmit({ name, email, phone, address, notes });
  }
  return (
    <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
      <TextField
        label="Name"
        value={name}
        onChange={(e) => setName(e.target.value)}
        autoComplete="off"
        required
      />
      <TextField
        label="E-mail"
        type="email"
        value={email}
        onChange={(e) => setEmail(e.target.value)}
        hint="Invoices and the shipping note go here."
        autoComplete="off"
      />
      <TextField
        label="Phone"
        type="tel"
        value={phone}
        onChange={(e) => setPhone(e.target.value)}
        autoComplete="off"
      />
      <TextAreaField
        label="Address"
        value={address}
        onChange={(e) => setAddress(e.target.value)}
        rows={3}
      />
      <TextAreaField
        label="Notes"
        value={notes}
        onChange={(e) => setNotes(e.target.value)}
        rows={2}
      />
      {error && <Notice tone="error" title={error} />}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={busy}>
          {submitLabel}
        </Button>
        {onCancel && (
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}
