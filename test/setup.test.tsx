// @vitest-environment jsdom
// Checks test/setup.ts for component tests: jest-dom matchers work and each test starts from an
// empty document because rendered trees are cleaned up after every test.
import { render, screen } from '@testing-library/react';

function Greeting({ name }: { name: string }) {
  return <p role="status">Hello {name}</p>;
}

describe('component test setup', () => {
  it('renders with react and matches with jest-dom', () => {
    render(<Greeting name="curve" />);
    expect(screen.getByRole('status')).toBeInTheDocument();
    expect(screen.getByRole('status')).toHaveTextContent('Hello curve');
  });

  it('starts the next test with the previous render cleaned up', () => {
    expect(screen.queryByRole('status')).not.toBeInTheDocument();
    expect(document.body.childElementCount).toBe(0);
  });
});
