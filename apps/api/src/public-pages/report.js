// Optional help on the game-tag report form; the form works the same without it. Plain ES5 so it runs
// on old phones: warn about an over-large photo before a slow upload, and stop a second tap from
// sending the report twice.
(function () {
  var form = document.getElementById('report-form');
  var photo = document.getElementById('photo');
  if (!form || !photo) return;
  var max = Number(photo.getAttribute('data-max-bytes')) || 0;
  var note = document.createElement('p');
  note.className = 'error';
  note.id = 'photo-size-error';
  note.setAttribute('role', 'alert');

  photo.addEventListener('change', function () {
    var file = photo.files && photo.files[0];
    if (max && file && file.size > max) {
      note.textContent =
        'This photo is too large (over ' + Math.round(max / 1048576) + ' MB). Choose a smaller one, or send the report without it.';
      photo.parentNode.insertBefore(note, photo);
      photo.setAttribute('aria-invalid', 'true');
      photo.value = '';
    } else if (note.parentNode) {
      note.parentNode.removeChild(note);
      photo.setAttribute('aria-invalid', 'false');
    }
  });

  var button = form.querySelector('button[type=submit]');
  var label = button ? button.textContent : '';
  form.addEventListener('submit', function () {
    if (!button) return;
    // Disabled after this turn of the event loop, so the browser still sends the form.
    setTimeout(function () {
      button.disabled = true;
      button.textContent = 'Sending…';
    }, 0);
  });
  // Coming back with the Back button shows the page from memory: make the button usable again.
  window.addEventListener('pageshow', function () {
    if (!button) return;
    button.disabled = false;
    button.textContent = label;
  });
})();
