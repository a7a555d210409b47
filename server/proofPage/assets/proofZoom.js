// Zoom for the customer's picture: buttons, a tap or click on the picture, and
// + - 0 on the keyboard while it has focus. Zoomed, the frame keeps its height
// and scrolls, so a finger, the mouse wheel or the arrow keys move around the
// picture. Pinching zooms the whole page as the browser always does. Without
// this script the page works the same, at the picture's fitted size. The
// buttons sit over the picture and the spoken status is out of the flow, so
// showing them moves nothing on the page.
(function () {
  'use strict';
  var STEPS = [1, 2, 4];
  var frame = document.querySelector('[data-zoom-frame]');
  var tools = document.querySelector('[data-zoom-tools]');
  if (!frame || !tools) return;
  var picture = frame.querySelector('svg');
  if (!picture) return;
  var step = 0;
  var fitted = null;

  function show(next, viewX, viewY) {
    next = Math.max(0, Math.min(STEPS.length - 1, next));
    if (next === step) return;
    var box = frame.getBoundingClientRect();
    if (step === 0) fitted = picture.getBoundingClientRect();
    // The board point under (viewX, viewY) stays there after the change.
    var px = viewX === undefined ? box.width / 2 : viewX;
    var py = viewY === undefined ? box.height / 2 : viewY;
    var ratio = STEPS[next] / STEPS[step];
    var left = (frame.scrollLeft + px - (step === 0 ? fitted.left - box.left : 0)) * ratio - px;
    var top = (frame.scrollTop + py - (step === 0 ? fitted.top - box.top : 0)) * ratio - py;
    step = next;
    if (step === 0) {
      frame.classList.remove('zoomed');
      frame.style.height = '';
      picture.style.width = '';
    } else {
      frame.style.height = Math.round(box.height) + 'px';
      frame.classList.add('zoomed');
      picture.style.width = Math.round(fitted.width * STEPS[step]) + 'px';
      frame.scrollLeft = Math.max(0, left);
      frame.scrollTop = Math.max(0, top);
    }
    frame.setAttribute('data-zoom', String(STEPS[step]));
    tools.querySelector('[data-zoom="out"]').disabled = step === 0;
    tools.querySelector('[data-zoom="in"]').disabled = step === STEPS.length - 1;
    status.textContent = step === 0 ? 'Showing the whole design' : 'Zoomed in ' + STEPS[step] + ' times';
  }

  var status = document.createElement('p');
  status.className = 'visually-hidden';
  status.setAttribute('role', 'status');
  tools.after(status);
  tools.hidden = false;
  frame.setAttribute('data-zoom', '1');
  tools.querySelector('[data-zoom="out"]').disabled = true;

  tools.addEventListener('click', function (event) {
    var button = event.target.closest('button[data-zoom]');
    if (!button) return;
    var kind = button.getAttribute('data-zoom');
    show(kind === 'in' ? step + 1 : kind === 'out' ? step - 1 : 0);
  });
  frame.addEventListener('click', function (event) {
    var box = frame.getBoundingClientRect();
    show(step === 0 ? 1 : 0, event.clientX - box.left, event.clientY - box.top);
  });
  frame.addEventListener('keydown', function (event) {
    if (event.key === '+' || event.key === '=') show(step + 1);
    else if (event.key === '-') show(step - 1);
    else if (event.key === '0') show(0);
    else return;
    event.preventDefault();
  });
})();
