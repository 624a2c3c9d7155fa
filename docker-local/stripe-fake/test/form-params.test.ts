import { describe, expect, it } from 'vitest';
import { asList, canonicalParams, FormParamsError, parseFormParams, splitKey } from '../src/form-params.ts';

describe('bracketed form parameters', () => {
  it('nests line items, price data and metadata the way the Stripe SDK encodes them', () => {
    const body =
      'mode=payment&line_items[0][price_data][currency]=usd&line_items[0][price_data][unit_amount]=1200' +
      '&line_items[0][price_data][product_data][name]=Fat%20quarters%2C%20batik&line_items[0][quantity]=2' +
      '&line_items[1][quantity]=1&metadata[orderId]=ord_17';
    const params = parseFormParams(body);
    expect(JSON.parse(JSON.stringify(params))).toEqual({
      mode: 'payment',
      line_items: {
        0: { price_data: { currency: 'usd', unit_amount: '1200', product_data: { name: 'Fat quarters, batik' } }, quantity: '2' },
        1: { quantity: '1' },
      },
      metadata: { orderId: 'ord_17' },
    });
  });

  it('accepts percent-encoded brackets and plus signs for spaces', () => {
    const params = parseFormParams('metadata%5BorderId%5D=ord_17&description=strips+and+squares');
    expect(params.metadata).toEqual({ orderId: 'ord_17' });
    expect(params.description).toBe('strips and squares');
  });

  it('appends for empty brackets, as in expand[]', () => {
    const params = parseFormParams('expand[]=payment_intent&expand[]=line_items');
    expect(asList(params.expand as Record<string, string>)).toEqual(['payment_intent', 'line_items']);
  });

  it('orders numeric keys by number, not by text', () => {
    const list = asList({ 10: 'k', 2: 'c', 0: 'a' });
    expect(list).toEqual(['a', 'c', 'k']);
    expect(asList({ 0: 'a', orderId: 'x' })).toBeNull();
  });

  it('keeps an empty value (the SDK sends key= for null)', () => {
    expect(parseFormParams('customer_email=&mode=payment')).toMatchObject({ customer_email: '', mode: 'payment' });
  });

  it('refuses names that would reach the object prototype', () => {
    expect(() => parseFormParams('metadata[__proto__][polluted]=1')).toThrow(FormParamsError);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  it('refuses a value that is both a string and a hash, and malformed names or encodings', () => {
    expect(() => parseFormParams('metadata=x&metadata[a]=1')).toThrow(FormParamsError);
    expect(() => parseFormParams('metadata[a]=1&metadata=x')).toThrow(FormParamsError);
    expect(() => splitKey('line_items[0')).toThrow(FormParamsError);
    expect(() => parseFormParams('name=%E0%A4%A')).toThrow(FormParamsError);
  });

  it('gives the same canonical text whatever the order of the pairs', () => {
    expect(canonicalParams(parseFormParams('a=1&b[y]=2&b[x]=3'))).toBe(canonicalParams(parseFormParams('b[x]=3&a=1&b[y]=2')));
    expect(canonicalParams(parseFormParams('a=1'))).not.toBe(canonicalParams(parseFormParams('a=2')));
  });
});
