// The web app is exported as pre-rendered pages (app.json's web.output "static").
// MATWRIGHT_RENDER_BUNDLE=1 exports it for a server instead, for the bundle that
// draws signed-in pages per request (scripts/buildWeb.mjs).
module.exports = ({ config }) => {
  if (process.env.MATWRIGHT_RENDER_BUNDLE !== '1') return config;
  const plugins = config.plugins.map((p) =>
    Array.isArray(p) && p[0] === 'expo-router' ? ['expo-router', { ...p[1], unstable_useServerRendering: true }] : p,
  );
  return { ...config, web: { ...config.web, output: 'server' }, plugins };
};
