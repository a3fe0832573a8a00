import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router';
import { describe, expect, it } from 'vitest';
import { LotUploadForm } from './LotUploadForm.js';

function renderForm() {
  render(
    <QueryClientProvider client={new QueryClient()}>
      <MemoryRouter>
        <LotUploadForm />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

describe('LotUploadForm', () => {
  it('names the missing name and file and sends nothing', async () => {
    renderForm();
    await userEvent.click(screen.getByRole('button', { name: 'Upload lot' }));
    expect(await screen.findByText('Give the lot a name.')).toBeInTheDocument();
    expect(screen.getByText('Choose a CSV file.')).toBeInTheDocument();
  });

  it('asks for the tube test point and checks its volts', async () => {
    renderForm();
    await userEvent.selectOptions(screen.getByLabelText('Kind'), 'tube');
    expect(screen.getByText(/ia1, gm1, ia2, gm2/)).toBeInTheDocument();
    await userEvent.type(screen.getByLabelText('Test point grid volts (V)'), '3');
    await userEvent.type(screen.getByLabelText('Lot name'), 'Box 4');
    await userEvent.click(screen.getByRole('button', { name: 'Upload lot' }));
    expect(await screen.findByText('Grid volts must be a number, 0 or below.')).toBeInTheDocument();
  });
});
