import { pastedAddresses } from './pasted-addresses';

describe('pastedAddresses', () => {
  it('takes addresses one per line, or separated by commas, semicolons or spaces', () => {
    expect(pastedAddresses('a@x.test\nb@x.test, c@x.test;d@x.test  e@x.test\n\n')).toEqual(['a@x.test', 'b@x.test', 'c@x.test', 'd@x.test', 'e@x.test']);
    expect(pastedAddresses('  \n ,; ')).toEqual([]);
  });
});
