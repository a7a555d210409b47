// Starts the app's scripts once the browser has painted the page the server drew
// (server/pages/drawingThread.mjs moves the page's script tags here, as a list in
// data-scripts, and preloads each). The scripts were fetched beside the page; here
// they only wait for the drawn page to reach the screen before they run, in their
// order. The page's text shows once its fonts are in (or given up on), so they wait for
// that too. A tab in the background paints no frames, so a timer stands in there.
(function () {
  var me = document.currentScript;
  var sources = ((me && me.getAttribute('data-scripts')) || '').split(' ').filter(Boolean);
  var started = false;
  function start() {
    if (started) return;
    started = true;
    for (var i = 0; i < sources.length; i++) {
      var script = document.createElement('script');
      script.src = sources[i];
      script.async = false;
      document.body.appendChild(script);
    }
  }
  var fonts = document.fonts ? document.fonts.ready : Promise.resolve();
  fonts.then(function () {
    requestAnimationFrame(function () {
      setTimeout(start, 0);
    });
  });
  setTimeout(start, 1500);
})();
