import { render, screen, waitFor, within } from '@testing-library/react';
import type { Design } from '@sigmatail/engine';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { defaultDesign } from './defaultDesign.js';
import { DesignForm } from './DesignForm.js';
import { evaluateNominal } from './useNominal.js';
import { LiveResults } from './LiveResults.js';

describe('live nominal results', () => {
  it('shows gains, balance, operating point and trim for a valid design', () => {
    render(<LiveResults state={evaluateNominal(defaultDesign())} />);
    const panel = screen.getByRole('region', { name: 'Live nominal results' });
    expect(within(panel).getByText('Differential gain')).toBeInTheDocument();
    expect(screen.getByTestId('balance').textContent).toMatch(/dB$/);
    expect(within(panel).getByText('Nearest E24')).toBeInTheDocument();
    expect(within(panel).getByText('Ia')).toBeInTheDocument();
  });

  it('plots the nominal frequency response with the −3 dB points, and opens a version-1 document', () => {
    const d = defaultDesign();
    const cap = (value: string) => ({ value, tolerance: 10, spread: { kind: 'normal' as const } });
    Object.assign(d.parts, { cout1: cap('22n'), cout2: cap('22n'), cg2: cap('100n') });
    d.parts.rload1 = { value: '470k', tolerance: 5, spread: { kind: 'normal' } };
    render(<LiveResults state={evaluateNominal(d)} />);
    expect(screen.getByRole('img', { name: 'Balance against frequency' })).toBeInTheDocument();
    expect(
      screen.getByRole('img', { name: 'Gain of output 1 and output 2 against frequency' }),
    ).toBeInTheDocument();
    expect(screen.getByTestId('large-signal').textContent).toMatch(/THD out 1 \/ out 2[\d.]+ % \/ [\d.]+ %/);
    expect(screen.getByTestId('corners').textContent).toMatch(/out 1 \d[\d.]* Hz … [\d.]+ [kM]Hz/);
    // A stored version-1 document (no capacitors) still evaluates.
    const v1 = { ...defaultDesign(), version: 1 };
    expect(evaluateNominal(v1).ok).toBe(true);
  });

  it('shows a split-load design as one section with plate and cathode outputs, its Bode plot and large signal, no trim', () => {
    const d = { ...defaultDesign(), topology: 'split-load' as const };
    d.supply = { bPlus: 300, tail: 0 };
    Object.assign(d.parts, {
      rl1: { value: '22k', tolerance: 5, spread: { kind: 'normal' } },
      rk: { value: '1k', tolerance: 5, spread: { kind: 'normal' } },
      rt: { value: '22k', tolerance: 5, spread: { kind: 'normal' } },
    });
    render(<LiveResults state={evaluateNominal(d)} />);
    const panel = screen.getByRole('region', { name: 'Live nominal results' });
    expect(within(panel).getByText('Gain to plate')).toBeInTheDocument();
    expect(within(panel).getByText('Gain to cathode')).toBeInTheDocument();
    expect(screen.getByTestId('balance').textContent).toMatch(/dB$/);
    expect(within(panel).queryByText('Nearest E24')).toBeNull();
    expect(within(panel).queryByText('CMRR')).toBeNull();
    expect(screen.getByRole('img', { name: 'Balance against frequency' })).toBeInTheDocument();
    expect(screen.getByTestId('large-signal').textContent).toMatch(
      /Symmetrical swing, plate \/ cathode[\d.]+ V \/ [\d.]+ V peak/,
    );
    expect(screen.getByTestId('large-signal').textContent).toMatch(
      /THD plate \/ cathode[\d.]+ % \/ [\d.]+ %/,
    );
    // A coupling capacitor into the cathode's load gives that output a low corner.
    const cap = (value: string) => ({ value, tolerance: 10, spread: { kind: 'normal' as const } });
    d.parts.rload2 = { value: '220k', tolerance: 10, spread: { kind: 'normal' } };
    Object.assign(d.parts, { cout2: cap('47n') });
    render(<LiveResults state={evaluateNominal(d)} />);
    expect(screen.getAllByTestId('corners')[1].textContent).toMatch(/out 2 \d[\d.]* Hz … /);
  });

  it('the topology choice offers the split-load splitter and then shows only its parts', async () => {
    render(<DesignForm initial={defaultDesign()} readOnly={false} onSave={async () => {}} />);
    expect(screen.getAllByText('RL2').length).toBeGreaterThan(0);
    await userEvent.selectOptions(screen.getByLabelText('Topology'), 'Split-load (cathodyne)');
    expect(await screen.findByLabelText('RL (plate load) value')).toBeInTheDocument();
    expect(screen.queryAllByText('RL2')).toEqual([]);
    expect(screen.queryAllByText('RG2')).toEqual([]);
    expect(await screen.findByText('Gain to cathode')).toBeInTheDocument();
  });

  it('saves a split-load design without RL2 and RG2, and a switch to a pair brings them back from RL1 and RG1', async () => {
    const base = defaultDesign();
    const { rl2: _rl2, rg2: _rg2, ...parts } = base.parts;
    const lean = { ...base, topology: 'split-load' as const, supply: { bPlus: 300, tail: 0 }, parts };
    const saved: Design[] = [];
    render(
      <DesignForm
        initial={lean}
        readOnly={false}
        onSave={async (doc) => {
          saved.push(doc);
        }}
      />,
    );
    await userEvent.click(screen.getByRole('button', { name: 'Save revision' }));
    await waitFor(() => expect(saved).toHaveLength(1));
    expect(saved[0].parts.rl2).toBeUndefined();
    expect(saved[0].parts.rg2).toBeUndefined();
    await userEvent.selectOptions(screen.getByLabelText('Topology'), 'Capacitor-coupled (grids leak to J)');
    expect(await screen.findByLabelText('RL2 value')).toHaveValue(String(base.parts.rl1.value));
    expect(screen.getByLabelText('RG2 value')).toHaveValue(String(base.parts.rg1.value));
    await userEvent.click(screen.getByRole('button', { name: 'Save revision' }));
    await waitFor(() => expect(saved).toHaveLength(2));
    expect(saved[1].parts.rl2).toEqual(base.parts.rl1);
  });

  it('names the fields to fix when the design does not parse', () => {
    const bad = {
      ...defaultDesign(),
      parts: { ...defaultDesign().parts, rk: { value: '4x7', tolerance: 5, spread: { kind: 'normal' } } },
    };
    render(<LiveResults state={evaluateNominal(bad)} />);
    expect(screen.getByText('parts.rk.value')).toBeInTheDocument();
  });

  it('warns when plate dissipation exceeds the tube rating', () => {
    // 12AX7 is rated 1 W per plate; 10k loads over a 1k tail at 320 V run each section hot (common practice, no source).
    const hot = defaultDesign();
    hot.supply.bPlus = 320;
    hot.parts.rl1.value = '10k';
    hot.parts.rl2!.value = '10k';
    hot.parts.rt.value = '1k';
    hot.parts.rk.value = '100R';
    render(<LiveResults state={evaluateNominal(hot)} />);
    expect(screen.getByRole('alert', { name: 'Rating warnings' }).textContent).toMatch(/dissipates/);
  });

  it('updates the balance as RL2 is typed in the editor', async () => {
    render(<DesignForm initial={defaultDesign()} readOnly={false} onSave={async () => undefined} />);
    const before = screen.getByTestId('balance').textContent;
    const rl2 = screen.getByLabelText('RL2 value');
    await userEvent.clear(rl2);
    await userEvent.type(rl2, '91k');
    await screen.findByText(
      (_, el) => el?.getAttribute('data-testid') === 'balance' && el.textContent !== before,
    );
    expect(screen.getByTestId('balance').textContent).not.toBe(before);
  });

  it('shows the form disabled in a read-only view', () => {
    render(<DesignForm initial={defaultDesign()} readOnly />);
    expect(screen.getByLabelText('Design name')).toBeDisabled();
    expect(screen.getByLabelText('RL1 value')).toBeDisabled();
    expect(screen.queryByRole('button', { name: /Save/ })).toBeNull();
  });
});

describe('switching to direct-coupled', () => {
  it('asks for the grid drive and evaluates once grid 1 DC is given', async () => {
    render(<DesignForm initial={defaultDesign()} readOnly={false} onSave={async () => undefined} />);
    await userEvent.selectOptions(screen.getByLabelText('Topology'), 'direct-coupled');
    const g1 = await screen.findByLabelText('Grid 1 DC (V)');
    // Near the cathode voltage this stage settles at when cap-coupled (about 18 V), so a bias point exists.
    await userEvent.type(g1, '20');
    await screen.findByTestId('balance');
    expect(screen.getByLabelText('Grid 2')).toHaveValue('leak-to-grid1');
  });
});
