import { useEffect, useId, useRef, type ReactNode } from 'react';
import { Button } from './button';
import { cx } from './cx';

export interface DialogProps {
  open: boolean;
  onClose: () => void;
  title: ReactNode;
  /** One or two sentences under the title; read out as the dialog's description. */
  description?: ReactNode;
  children?: ReactNode;
  /** Buttons at the bottom right; put the safe choice first. */
  footer?: ReactNode;
  size?: 'sm' | 'md' | 'lg';
}

const WIDTHS = { sm: 'max-w-sm', md: 'max-w-lg', lg: 'max-w-3xl' } as const;

/**
 * A modal built on the native <dialog>: showModal() makes the rest of the page
 * inert (that is the focus trap), Escape fires "cancel", and focus goes back to
 * the opener on close, all without extra code to get wrong.
 */
export function Dialog({ open, onClose, title, description, children, footer, size = 'md' }: DialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const descriptionId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={description ? descriptionId : undefined}
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      onClick={(e) => {
        // A click on the backdrop lands on the <dialog> element itself.
        if (e.target === ref.current) onClose();
      }}
      className={cx(
        // The dialog never outgrows the window: its body scrolls between a fixed title and footer, so focusing
        // a footer button (autoFocus) cannot scroll the title out of sight.
        'm-auto max-h-[calc(100dvh-2rem)] w-[calc(100%-2rem)] overflow-hidden rounded-card border border-line bg-paper-raised p-0 text-ink shadow-xl backdrop:bg-ink/40',
        WIDTHS[size],
      )}
    >
      {open && (
        <div className="flex max-h-[calc(100dvh-2rem)] flex-col">
          <div className="shrink-0 px-5 pt-4 pb-3">
            <h2 id={titleId} className="text-lead font-semibold">
              {title}
            </h2>
            {description && (
              <p id={descriptionId} className="mt-1 text-body text-ink-soft">
                {description}
              </p>
            )}
          </div>
          {children && <div className="min-h-0 overflow-y-auto px-5 pb-4" data-dialog-body>{children}</div>}
          {footer && <div className="flex shrink-0 justify-end gap-2 border-t border-line bg-paper px-5 py-3">{footer}</div>}
        </div>
      )}
    </dialog>
  );
}

export interface ConfirmDialogProps {
  open: boolean;
  title: ReactNode;
  description?: ReactNode;
  confirmLabel: string;
  /** danger for removing or rejecting things. */
  tone?: 'primary' | 'danger';
  busy?: boolean;
  /** Shown inside the dialog, e.g. a FormError for a failed attempt. */
  children?: ReactNode;
  onConfirm: () => void;
  onClose: () => void;
}

/** "Are you sure?" with the cancel button focused first, so Enter does not destroy anything. */
export function ConfirmDialog({ open, title, description, confirmLabel, tone = 'danger', busy, children, onConfirm, onClose }: ConfirmDialogProps) {
  return (
    <Dialog
      open={open}
      onClose={onClose}
      title={title}
      description={description}
      size="sm"
      footer={
        <>
          <Button autoFocus variant="secondary" onClick={onClose} disabled={busy}>
            Cancel
          </Button>
          <Button variant={tone} onClick={onConfirm} busy={busy}>
            {confirmLabel}
          </Button>
        </>
      }
    >
      {children}
    </Dialog>
  );
}
