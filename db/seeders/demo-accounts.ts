// The invented people of Scribeline's demo. Passwords are for the local demo only.
export const DEMO_PASSWORD = 'shop-demo-2026';

export const DEMO_ACCOUNTS = [
  { key: 'builder', name: 'Edda Renwick', email: 'edda@renwick-shop.test', siteRole: 'member', role: 'builder' },
  { key: 'follower', name: 'Tobias Quill', email: 'tobias@quill.test', siteRole: 'member', role: 'follower' },
  { key: 'mentor', name: 'Agnes Farrow', email: 'agnes@farrow.test', siteRole: 'member', role: 'mentor' },
  { key: 'admin', name: 'Juno Pell', email: 'juno@scribeline.test', siteRole: 'admin', role: 'admin' },
] as const;
