import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { Design } from '@sigmatail/engine';
import { describe, expect, it } from 'vitest';
import { defaultDesign } from './defaultDesign.js';
import { DesignForm } from './DesignForm.js';

const saving = () => {
  const saved: Design[] = [];
  return { saved, onSave: async (doc: Design) => void saved.push(doc) };
};

describe('resistor kind in the design editor', () => {
  it('puts a changed kind into the saved document and leaves the other parts without one', async () => {
    const { saved, onSave } = saving();
    render(<DesignForm initial={defaultDesign()} readOnly={false} onSave={onSave} />);
    const rk = screen.getByLabelText('Rk kind');
    expect(rk).toHaveValue('metal-film');
    await userEvent.selectOptions(rk, 'Carbon film');
    await userEvent.click(screen.getByRole('button', { name: 'Save revision' }));
    await waitFor(() => expect(saved).toHaveLength(1));
    expect(saved[0]!.parts.rk.kind).toBe('carbon-film');
    expect(JSON.parse(JSON.stringify(saved[0]!.parts.rl1))).not.toHaveProperty('kind');
  });

  it('leaves the kind out again when set back to metal film, so older documents save unchanged', async () => {
    const { saved, onSave } = saving();
    const initial = defaultDesign();
    initial.parts.rt.kind = 'carbon-comp';
    render(<DesignForm initial={initial} readOnly={false} onSave={onSave} />);
    const rt = screen.getByLabelText('Rt kind');
    expect(rt).toHaveValue('carbon-comp');
    await userEvent.selectOptions(rt, 'Metal film');
    await userEvent.click(screen.getByRole('button', { name: 'Save revision' }));
    await waitFor(() => expect(saved).toHaveLength(1));
    expect(JSON.parse(JSON.stringify(saved[0]!))).toEqual(JSON.parse(JSON.stringify(defaultDesign())));
  });

  it('shows the kind read-only to viewers and offers none for capacitors', () => {
    const initial = defaultDesign();
    initial.parts.rg1.kind = 'carbon-comp';
    initial.parts.cout1 = { value: '22n', tolerance: 10, spread: { kind: 'normal' } };
    render(<DesignForm initial={initial} readOnly />);
    const rg1 = screen.getByLabelText('RG1 kind');
    expect(rg1).toBeDisabled();
    expect(rg1).toHaveDisplayValue('Carbon composition');
    expect(screen.getByLabelText('Cout1 (output 1 coupling) value')).toBeInTheDocument();
    expect(screen.queryByLabelText(/^Cout1.* kind$/)).toBeNull();
  });
});
