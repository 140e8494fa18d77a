// The parts of three.js the browser view uses, bundled by build_vendor.sh into
// vendor/three.bundle.min.js as one global, THREE.
export {
  WebGLRenderer, Scene, PerspectiveCamera, Color, BufferGeometry, Float32BufferAttribute,
  LineSegments, LineBasicMaterial, Raycaster, Vector2, Vector3, Box3, Sphere,
} from 'three';
export { OrbitControls } from 'three/examples/jsm/controls/OrbitControls.js';
