// @vitest-environment happy-dom
import { postalAddressSchema } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { act } from 'react';
import { afterEach, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { SESSION_CACHE_KEY } from '../utils/guild-session.ts';
import { createQueryClient } from '../lib/react-query.ts';
import { makeSession, makeUser, testGuild } from '../testing/fixtures.ts';
import { buttonNamed, byLabel, cleanup, click, render, waitFor } from '../testing/render.tsx';
import { CountryField } from './postal-fields.tsx';
import { Form, SubmitButton } from './ui/form.tsx';

afterEach(() => cleanup());

const countrySchema = z.object({ country: postalAddressSchema.shape.country });

/** A form with only the country, in a guild whose postage table covers `postageCountries`; gives what it sends. */
async function countryForm(postageCountries: string[], country: string) {
  const client = createQueryClient();
  client.setQueryData(SESSION_CACHE_KEY, { ...makeSession(makeUser()), guild: { ...testGuild, currency: 'USD', postageCountries } });
  const sent: Array<{ country: string }> = [];
  const rendered = await render(
    <QueryClientProvider client={client}>
      <Form schema={countrySchema} defaultValues={{ country }} onSubmit={(values) => void sent.push(values)}>
        <CountryField name="country" />
        <SubmitButton>Save</SubmitButton>
      </Form>
    </QueryClientProvider>,
  );
  const send = async () => {
    await click(buttonNamed(rendered.container, 'Save'));
    await waitFor(() => expect(sent).toHaveLength(1));
    return sent[0];
  };
  return { ...rendered, send };
}

describe('the country of an address', () => {
  it('is a choice of the countries the guild posts to, sent as the two-letter code', async () => {
    const { container, send } = await countryForm(['US', 'CA'], 'CA');
    const select = byLabel<HTMLSelectElement>(container, 'Country');
    expect([...select.options].map((option) => [option.value, option.text])).toEqual([
      ['US', 'United States'],
      ['CA', 'Canada'],
    ]);
    expect(select.value).toBe('CA');
    expect(await send()).toEqual({ country: 'CA' });
  });

  it('is plain text, with a note, when the guild posts within one country', async () => {
    const { container, send } = await countryForm(['US'], '');
    expect(container.querySelector('select')).toBeNull();
    expect(container.textContent).toContain('United States');
    expect(container.textContent).toContain('The guild posts within United States only.');
    expect(await send()).toEqual({ country: 'US' });
  });

  it('replaces what is not a country (left by the old text box) with the first choice', async () => {
    const { container, send } = await countryForm(['US', 'CA'], 'UN');
    await waitFor(() => expect(byLabel<HTMLSelectElement>(container, 'Country').value).toBe('US'));
    expect(await send()).toEqual({ country: 'US' });
  });
});

describe('an address saved in a country the guild does not post to', () => {
  it('stays as it is, marked, with a note on what to do instead', async () => {
    const { container, send } = await countryForm(['US'], 'CA');
    const select = byLabel<HTMLSelectElement>(container, 'Country');
    expect([...select.options].map((option) => option.text)).toEqual(['United States', 'Canada (no postage rates)']);
    expect(select.value).toBe('CA');
    expect(container.textContent).toContain('The guild’s postage table has no rates for Canada: bundles can be collected at a guild meeting instead.');
    expect(await send()).toEqual({ country: 'CA' });
  });

  it('can be switched to a country the guild posts to, and back', async () => {
    const { container } = await countryForm(['US'], 'CA');
    const select = byLabel<HTMLSelectElement>(container, 'Country');
    await choose(select, 'US');
    expect(byLabel<HTMLSelectElement>(container, 'Country').value).toBe('US');
    expect(container.textContent).not.toContain('has no rates');
    await choose(byLabel<HTMLSelectElement>(container, 'Country'), 'CA');
    expect(byLabel<HTMLSelectElement>(container, 'Country').value).toBe('CA');
  });
});

async function choose(select: HTMLSelectElement, value: string) {
  await act(async () => {
    select.value = value;
    select.dispatchEvent(new Event('change', { bubbles: true }));
  });
}
