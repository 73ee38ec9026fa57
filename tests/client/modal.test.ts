import { createElement } from 'react';
import { renderToString } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { Modal } from '../../src/app/ui/controls';

describe('Modal: each dialog named by its own title', () => {
  it('gives two dialogs on one page different title ids, each pointing at its own heading', () => {
    const noop = () => {};
    const html = renderToString(
      createElement(
        'div',
        null,
        createElement(Modal, { open: true, onClose: noop, title: 'Save version', children: 'a' }),
        createElement(Modal, { open: true, onClose: noop, title: 'Approve version 2', children: 'b' }),
      ),
    );
    const dialogs = [...html.matchAll(/<dialog[^>]*aria-labelledby="([^"]+)"[^>]*>.*?<h2 id="([^"]+)"[^>]*>([^<]*)<\/h2>/g)].map((m) => ({ labelledBy: m[1], headingId: m[2], title: m[3] }));
    expect(dialogs.map((d) => d.title)).toEqual(['Save version', 'Approve version 2']);
    for (const d of dialogs) expect(d.labelledBy).toBe(d.headingId);
    expect(dialogs[0].labelledBy).not.toBe(dialogs[1].labelledBy);
  });
});
