import { Button } from './button';

type Props = {
  pending: boolean;
  /** The submit button's words; it says "Saving…" while the request runs. */
  label: string;
  onCancel?: (() => void) | undefined;
  cancelVariant?: 'quiet' | 'secondary';
  className?: string;
};

/** A form's submit button and its optional Cancel, as every edit-in-place form ends. */
export function FormActions({ pending, label, onCancel, cancelVariant = 'quiet', className = 'flex gap-2' }: Props) {
  return (
    <div className={className}>
      <Button type="submit" disabled={pending}>
        {pending ? 'Saving…' : label}
      </Button>
      {onCancel ? (
        <Button variant={cancelVariant} onClick={onCancel}>
          Cancel
        </Button>
      ) : null}
    </div>
  );
}
