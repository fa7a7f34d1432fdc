// Every route of the app in one place: components link with paths.x.getHref(), the router uses paths.x.path.
export const paths = {
  signIn: {
    path: '/sign-in',
    getHref: (redirectTo?: string | null) =>
      `/sign-in${redirectTo && redirectTo !== '/' ? `?redirectTo=${encodeURIComponent(redirectTo)}` : ''}`,
  },
  app: {
    root: { path: '/', getHref: () => '/' },
    links: { path: '/links', getHref: () => '/links' },
    newLink: { path: '/links/new', getHref: () => '/links/new' },
    link: { path: '/links/:linkId', getHref: (linkId: string) => `/links/${encodeURIComponent(linkId)}` },
    linkHistory: {
      path: '/links/:linkId/history',
      getHref: (linkId: string) => `/links/${encodeURIComponent(linkId)}/history`,
    },
    sites: { path: '/sites', getHref: () => '/sites' },
    newSite: { path: '/sites/new', getHref: () => '/sites/new' },
    site: { path: '/sites/:siteId', getHref: (siteId: string) => `/sites/${encodeURIComponent(siteId)}` },
    catalogue: { path: '/catalogue', getHref: () => '/catalogue' },
    newEquipment: {
      path: '/catalogue/new/:kind',
      getHref: (kind: 'transmitter' | 'receiver') => `/catalogue/new/${kind}`,
    },
    equipment: { path: '/catalogue/:modelId', getHref: (modelId: string) => `/catalogue/${encodeURIComponent(modelId)}` },
    catalogueImport: { path: '/catalogue/import', getHref: () => '/catalogue/import' },
    settings: { path: '/settings', getHref: () => '/settings' },
    linkAvailability: {
      path: '/links/:linkId/availability',
      getHref: (linkId: string) => `/links/${encodeURIComponent(linkId)}/availability`,
    },
    weatherDatasets: { path: '/weather', getHref: () => '/weather' },
  },
} as const;
