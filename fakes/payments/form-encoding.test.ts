import { describe, expect, it } from 'vitest';
import { parseBracketedForm } from './form-encoding';

describe('bracketed form decoding', () => {
  it('builds nested objects and arrays from the keys the SDK sends', () => {
    const encoded =
      'mode=payment&line_items[0][price_data][currency]=usd&line_items[0][price_data][unit_amount]=4500' +
      '&line_items[0][price_data][product_data][name]=Drum%20tracking%2C%20one%20song&line_items[0][quantity]=1' +
      '&line_items[1][quantity]=2&metadata[booking]=b1&expand[0]=payment_intent&success_url=http%3A%2F%2Fapp.test%2Fok%3Fs%3D%7BCHECKOUT_SESSION_ID%7D';
    expect(parseBracketedForm(encoded)).toEqual({
      mode: 'payment',
      line_items: [
        { price_data: { currency: 'usd', unit_amount: '4500', product_data: { name: 'Drum tracking, one song' } }, quantity: '1' },
        { quantity: '2' },
      ],
      metadata: { booking: 'b1' },
      expand: ['payment_intent'],
      success_url: 'http://app.test/ok?s={CHECKOUT_SESSION_ID}',
    });
  });

  it('accepts percent-encoded brackets, plus signs for spaces, and empty-bracket appends', () => {
    expect(parseBracketedForm('expand%5B%5D=a&expand%5B%5D=b&card=4242+4242')).toEqual({ expand: ['a', 'b'], card: '4242 4242' });
  });

  it('keeps an empty value, which means "unset" on the wire', () => {
    expect(parseBracketedForm('metadata[note]=&description=')).toEqual({ metadata: { note: '' }, description: '' });
  });
});
