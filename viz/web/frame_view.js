// stepframe's browser view of a solved frame: the members as lines in 3D, coloured on the
// project's own scales (the same colours as every picture: the scales come with the data),
// orbit and zoom, a choice of result and quantity, and a member's checks and forces on a click.
// Reads its data from <script type="application/json" id="sf-view-data">; draws with three.js
// (bundled beside it as the global THREE). With "#selftest" in the address it checks itself
// (images decode, the view draws, a click picks a member) and writes the outcome into
// the element with id sf-selftest for the test suite's headless browser.
(function () {
  'use strict';
  const errors = [];
  window.addEventListener('error', (e) => errors.push(String(e.message || e)));
  const consoleError = console.error.bind(console);
  console.error = (...args) => { errors.push(args.map(String).join(' ')); consoleError(...args); };

  const data = JSON.parse(document.getElementById('sf-view-data').textContent);
  const host = document.getElementById('sf-view');
  const panel = document.getElementById('sf-view-panel');
  const resultChoice = document.getElementById('sf-view-result');
  const quantityChoice = document.getElementById('sf-view-quantity');
  const legend = document.getElementById('sf-view-legend');

  // Quantities: [label, per-result?, signed?, unit divisor, unit label, extreme index (N, Vy, Vz, T, My, Mz)]
  const quantities = {
    utilisation: { label: 'governing utilisation (all results)', perResult: false },
    stress: { label: 'von Mises stress / fy', perResult: true },
    N: { label: 'axial force N (tension +)', perResult: true, signed: true, component: 0, scale: 1e3, unit: 'kN' },
    My: { label: 'bending moment My', perResult: true, signed: true, component: 4, scale: 1e3, unit: 'kN·m' },
    Mz: { label: 'bending moment Mz', perResult: true, signed: true, component: 5, scale: 1e3, unit: 'kN·m' },
  };
  for (const [key, q] of Object.entries(quantities)) quantityChoice.add(new Option(q.label, key));
  data.results.forEach((r, i) => resultChoice.add(new Option(`${r.name} (${r.kind})`, String(i))));
  resultChoice.value = String(Math.max(0, data.results.findIndex((r) => r.name === data.initial_result)));

  // --- scene ---------------------------------------------------------------------------------
  const width = () => host.clientWidth || 800;
  const height = () => host.clientHeight || 500;
  const renderer = new THREE.WebGLRenderer({ antialias: true, preserveDrawingBuffer: true });
  renderer.setPixelRatio(window.devicePixelRatio || 1);
  renderer.setSize(width(), height());
  renderer.setClearColor(0xffffff, 1);
  host.appendChild(renderer.domElement);
  const scene = new THREE.Scene();

  const positions = [];
  const segmentMember = [];
  data.members.forEach((m, index) => {
    for (let k = 0; k + 1 < m.path.length; ++k) {
      for (const n of [m.path[k], m.path[k + 1]])
        positions.push(data.nodes[3 * n], data.nodes[3 * n + 1], data.nodes[3 * n + 2]);
      segmentMember.push(index);
    }
  });
  const geometry = new THREE.BufferGeometry();
  geometry.setAttribute('position', new THREE.Float32BufferAttribute(positions, 3));
  const colours = new Float32Array(positions.length);
  geometry.setAttribute('color', new THREE.Float32BufferAttribute(colours, 3));
  const lines = new THREE.LineSegments(geometry, new THREE.LineBasicMaterial({ vertexColors: true }));
  scene.add(lines);
  geometry.computeBoundingSphere();
  const sphere = geometry.boundingSphere;

  const camera = new THREE.PerspectiveCamera(35, width() / height(), sphere.radius / 100, sphere.radius * 100);
  camera.up.set(0, 0, 1);  // Z up, as the model
  const direction = new THREE.Vector3(1, -1.2, 0.8).normalize();
  camera.position.copy(sphere.center).addScaledVector(direction, 2.6 * sphere.radius);
  const controls = new THREE.OrbitControls(camera, renderer.domElement);
  controls.target.copy(sphere.center);
  controls.update();
  const draw = () => renderer.render(scene, camera);
  controls.addEventListener('change', draw);
  window.addEventListener('resize', () => {
    renderer.setSize(width(), height());
    camera.aspect = width() / height();
    camera.updateProjectionMatrix();
    draw();
  });

  // --- colours: the scales of the pictures, 101 steps each, sent with the data -----------------
  const hexToRgb = (h) => [1, 3, 5].map((i) => parseInt(h.substr(i, 2), 16) / 255);
  const scaleColour = (scale, t) => hexToRgb(scale[Math.round(Math.min(Math.max(t, 0), 1) * (scale.length - 1))]);
  const utilisationColour = (u) =>
    u === null || u === undefined || Number.isNaN(u) ? hexToRgb(data.scales.not_checked)
      : u > 1 ? hexToRgb(data.scales.above_limit) : scaleColour(data.scales.utilisation, u);
  const signedValue = (extremes, c) => (Math.abs(extremes[2 * c]) >= Math.abs(extremes[2 * c + 1]) ? extremes[2 * c] : extremes[2 * c + 1]);

  function memberValue(key, result, index) {
    if (key === 'utilisation') return data.members[index].u;
    if (key === 'stress') return result.stress[index];
    return signedValue(result.extremes[index], quantities[key].component);
  }

  function recolour() {
    const key = quantityChoice.value;
    const q = quantities[key];
    const result = data.results[Number(resultChoice.value)];
    resultChoice.disabled = !q.perResult;
    let largest = 0;
    if (q.signed) data.members.forEach((m, i) => { largest = Math.max(largest, Math.abs(memberValue(key, result, i))); });
    for (let s = 0; s < segmentMember.length; ++s) {
      const v = memberValue(key, result, segmentMember[s]);
      const rgb = q.signed ? scaleColour(data.scales.signed, largest > 0 ? 0.5 * (v / largest + 1) : 0.5) : utilisationColour(v);
      colours.set(rgb, 6 * s);
      colours.set(rgb, 6 * s + 3);
    }
    geometry.attributes.color.array.set(colours);
    geometry.attributes.color.needsUpdate = true;
    legend.innerHTML = q.signed
      ? `<span>${(-largest / q.scale).toPrecision(3)} ${q.unit}</span>` +
        `<span class="sf-bar" style="background:linear-gradient(to right,${data.scales.signed.join(',')})"></span>` +
        `<span>+${(largest / q.scale).toPrecision(3)} ${q.unit}</span>`
      : `<span>0</span><span class="sf-bar" style="background:linear-gradient(to right,${data.scales.utilisation.join(',')})"></span>` +
        `<span>1.0</span><span class="sf-swatch" style="background:${data.scales.above_limit}"></span><span>above limit</span>` +
        `<span class="sf-swatch" style="background:${data.scales.not_checked}"></span><span>not checked</span>`;
    draw();
  }
  quantityChoice.addEventListener('change', recolour);
  resultChoice.addEventListener('change', () => { recolour(); if (panel.dataset.member) show(Number(panel.dataset.member)); });

  // --- picking -------------------------------------------------------------------------------
  const esc = (s) => String(s).replace(/[&<>"]/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;' }[c]));
  const fmt = (v, digits = 3) => (v === null || v === undefined ? '' : Number(v).toPrecision(digits));
  const names = ['N', 'Vy', 'Vz', 'T', 'My', 'Mz'];
  const units = ['kN', 'kN', 'kN', 'kN·m', 'kN·m', 'kN·m'];

  function show(index) {
    const m = data.members[index];
    const result = data.results[Number(resultChoice.value)];
    let html = `<h3>Member ${esc(m.id)}${m.label ? ' · ' + esc(m.label) : ''}</h3>` +
      `<p>${esc(m.section)} · ${esc(m.material)} · ${fmt(m.length, 4)} m</p>`;
    const checks = data.checks[index] || [];
    html += `<table class="sf-checks"><tr><th>check</th><th>result</th><th>value</th><th>limit</th><th>utilisation</th></tr>`;
    for (const c of checks)
      html += `<tr class="${c[5] ? '' : 'failed'}"><td>${esc(c[0])}</td><td>${esc(c[1])}</td><td>${esc(c[2])}</td>` +
        `<td>${esc(c[3])}</td><td>${fmt(c[4])}</td></tr>`;
    if (!checks.length) html += '<tr><td colspan="5">no checks</td></tr>';
    html += `</table><table class="sf-forces"><tr><th>${esc(result.name)}</th><th>max</th><th>min</th></tr>`;
    const e = result.extremes[index];
    names.forEach((n, c) => {
      html += `<tr><td>${n} ${units[c]}</td><td>${fmt(e[2 * c] / 1e3)}</td><td>${fmt(e[2 * c + 1] / 1e3)}</td></tr>`;
    });
    html += '</table>';
    if (m.sheet) html += `<p><a href="#${esc(m.sheet)}">calculation sheet</a></p>`;
    panel.innerHTML = html;
    panel.dataset.member = String(index);
    panel.dataset.checks = String(checks.length);
  }

  const raycaster = new THREE.Raycaster();
  const pointer = new THREE.Vector2();
  let down = null;
  function pick(clientX, clientY) {
    const box = renderer.domElement.getBoundingClientRect();
    pointer.set(((clientX - box.left) / box.width) * 2 - 1, -((clientY - box.top) / box.height) * 2 + 1);
    raycaster.setFromCamera(pointer, camera);
    // A click within a few pixels of a line picks it: the threshold is a world distance at the target.
    raycaster.params.Line.threshold = (6 / box.height) * camera.position.distanceTo(controls.target) *
      Math.tan((camera.fov * Math.PI) / 360) * 2;
    const hits = raycaster.intersectObject(lines);
    if (!hits.length) return -1;
    const index = segmentMember[Math.floor(hits[0].index / 2)];
    show(index);
    return index;
  }
  renderer.domElement.addEventListener('pointerdown', (e) => { down = [e.clientX, e.clientY]; });
  renderer.domElement.addEventListener('pointerup', (e) => {
    if (down && Math.hypot(e.clientX - down[0], e.clientY - down[1]) < 5) pick(e.clientX, e.clientY);
    down = null;
  });

  quantityChoice.value = 'utilisation';
  recolour();

  // --- self-test for the headless browser ----------------------------------------------------
  if (location.hash !== '#selftest') return;
  (async function selftest() {
    const outcome = { errors };
    const images = [...document.images];
    outcome.images = images.length;
    outcome.images_decoded = (await Promise.all(images.map((img) => img.decode().then(() => img.naturalWidth > 0, () => false))))
      .filter(Boolean).length;
    draw();
    const gl = renderer.getContext();
    const w = gl.drawingBufferWidth, h = gl.drawingBufferHeight;
    const pixels = new Uint8Array(4 * w * h);
    gl.readPixels(0, 0, w, h, gl.RGBA, gl.UNSIGNED_BYTE, pixels);
    let drawn = 0;
    for (let i = 0; i < pixels.length; i += 4) if (pixels[i] < 250 || pixels[i + 1] < 250 || pixels[i + 2] < 250) ++drawn;
    outcome.view_pixels = drawn;
    // Click the middle of the first segment of the governing member, as a user would.
    const target = data.members.reduce((best, m, i) => ((m.u ?? -1) > (data.members[best].u ?? -1) ? i : best), 0);
    const s = segmentMember.indexOf(target);
    const mid = new THREE.Vector3(positions[6 * s] + positions[6 * s + 3], positions[6 * s + 1] + positions[6 * s + 4],
      positions[6 * s + 2] + positions[6 * s + 5]).multiplyScalar(0.5).project(camera);
    const box = renderer.domElement.getBoundingClientRect();
    const x = box.left + ((mid.x + 1) / 2) * box.width, y = box.top + ((1 - mid.y) / 2) * box.height;
    controls.enabled = false;  // a synthetic pointer cannot be captured by the orbit controls
    for (const type of ['pointerdown', 'pointerup'])
      renderer.domElement.dispatchEvent(new PointerEvent(type, { clientX: x, clientY: y, bubbles: true, pointerId: 1, isPrimary: true }));
    outcome.target_member = target;
    outcome.picked_member = panel.dataset.member === undefined ? -1 : Number(panel.dataset.member);
    outcome.picked_check_rows = panel.querySelectorAll('table.sf-checks tr').length - 1;
    outcome.picked_checks_expected = outcome.picked_member >= 0 ? (data.checks[outcome.picked_member] || []).length : -1;
    const out = document.createElement('pre');
    out.id = 'sf-selftest';
    out.textContent = JSON.stringify(outcome);
    document.body.appendChild(out);
  })();
})();
