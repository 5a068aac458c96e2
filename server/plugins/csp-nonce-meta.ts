// Pages carry their script nonce in <meta property="csp-nonce">: Vite's chunk preloader reads it
// there and gives the <link rel="modulepreload"> tags it adds on client-side navigation the same
// nonce, so they pass the content security policy ('strict-dynamic' trusts scripts, not links).
export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('render:html', (html, { event }) => {
    const nonce = (event.context.security as { nonce?: string } | undefined)?.nonce
    if (nonce && /^[A-Za-z0-9+/=_-]+$/.test(nonce)) html.head.unshift(`<meta property="csp-nonce" nonce="${nonce}">`)
  })
})
