// The unit stage runs in Node with no DOM and in a fixed time zone (package.json `test:spec`),
// so date logic is exercised away from UTC, where an accidental local-time conversion shows.
describe('unit test environment', () => {
  it('has no DOM unless a file asks for jsdom', () => {
    expect(typeof window).toBe('undefined');
    expect(typeof document).toBe('undefined');
  });

  it('runs in America/Los_Angeles', () => {
    expect(Intl.DateTimeFormat().resolvedOptions().timeZone).toBe('America/Los_Angeles');
    // PST is UTC-8 in January, PDT is UTC-7 in July.
    expect(new Date('2024-01-15T12:00:00Z').getTimezoneOffset()).toBe(480);
    expect(new Date('2024-07-15T12:00:00Z').getTimezoneOffset()).toBe(420);
  });

  it('has the jest-dom matchers registered, failing without a DOM node', () => {
    expect(() => expect({}).toBeInTheDocument()).toThrowError(/HTMLElement|SVGElement/);
  });
});
