#pragma once
// The browser view: an interactive 3D view of a solved frame inside a
// self-contained HTML page (orbit, zoom, choice of result and quantity, a
// member's checks and forces on a click). Drawn by three.js, whose minified
// release is compiled into the program with its licence (viz/web/vendor;
// viz/web/build_vendor.sh regenerates it), so a page works offline and the
// build needs no network. The page supplies the data as JSON in
// <script type="application/json" id="sf-view-data"> and the elements
// described in viz/web/frame_view.js; plugin/src/report_view.cpp does.

#include "stepframe/viz/colour_scale.hpp"

#include <string>
#include <string_view>

namespace stepframe::viz {

/// three.js as one global, THREE (the parts the view uses).
std::string_view three_js_bundle();
/// three.js's licence text (MIT), to be shipped with every page that carries it.
std::string_view three_js_licence();
/// The view itself (our code).
std::string_view frame_view_script();

/// The colour scales as the view's data carries them: 101 steps of each scale
/// and the flag colours, "#rrggbb", so the view colours exactly as the pictures.
std::string colour_scales_json();

}  // namespace stepframe::viz
