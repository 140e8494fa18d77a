// results.json (schema stepframe-results/1; README "results.json"), written
// as a stream: one line per node, member, member result and check, so that a
// building-sized document is never held whole and reads line by line.

#include "stepframe/run.hpp"

#include "json_shapes.hpp"
#include "stepframe/analysis/local_axes.hpp"
#include "stepframe/analysis/member_line.hpp"

#include <functional>


namespace stepframe {
namespace {

using detail::JsonWriter;

using json_shapes::source;

void vec3(JsonWriter& w, const Eigen::Vector3d& v) { json_shapes::vec(w, v); }
void vec6(JsonWriter& w, const analysis::Vector6d& v) {
  w.numbers(std::array<double, 6>{v[0], v[1], v[2], v[3], v[4], v[5]});
}

// Every check; the clause text and intermediate values only where `detailed` (outputs.check_details).
void write_checks(JsonWriter& w, const std::vector<analysis::CheckResult>& checks,
                  const std::function<bool(const analysis::CheckResult&)>& detailed) {
  w.begin_array();
  for (const auto& c : checks) {
    const bool details = detailed(c);
    w.newline();
    w.begin_object();
    if (c.member == analysis::whole_frame) w.key("member").null();
    else w.key("member").value(c.member);
    w.key("check").value(c.check);
    if (details) w.key("clause").value(c.clause);
    w.key("combination").value(c.combination);
    w.key("station").value(c.station);
    w.key("value").value(c.value);
    w.key("limit").value(c.limit);
    w.key("utilisation").value(c.utilisation);
    w.key("pass").value(c.pass);
    if (details && !c.details.empty()) {
      w.key("details").begin_object();
      for (const auto& [name, value] : c.details) w.key(name).value(value);
      w.end_object();
    }
    w.end_object();
  }
  w.end_array();
}

// A member split into elements (where other members end on it, or along a curve): the internal forces
// just before and just after each inner node, x from the member's start.
void inner_node_forces(JsonWriter& w, const analysis::FrameModel& model, const analysis::LoadResult& r,
                       const analysis::Member& member) {
  w.key("inner_nodes").begin_array();
  double x = 0;
  analysis::LineResult previous = analysis::element_line(model, r, member.elements.front(), 2, analysis::LineDetail::forces);
  for (std::size_t k = 1; k < member.elements.size(); ++k) {
    x += previous.length;
    analysis::LineResult next = analysis::element_line(model, r, member.elements[k], 2, analysis::LineDetail::forces);
    w.begin_object();
    w.key("node").value(model.elements[member.elements[k]].nodes[0]);
    w.key("x").value(x);
    w.key("before");
    vec6(w, previous.end_forces);
    w.key("after");
    vec6(w, next.start_forces);
    w.end_object();
    previous = std::move(next);
  }
  w.end_array();
}

void displacements(JsonWriter& w, const analysis::FrameModel& model, const analysis::LoadResult& r) {
  w.key("displacements").begin_array();
  for (std::size_t n = 0; n < model.nodes.size(); ++n) {
    const auto d = r.displacements.segment<6>(static_cast<Eigen::Index>(6 * n));
    w.newline();
    w.begin_object();
    w.key("node").value(n);
    w.key("u");
    vec3(w, d.head<3>());
    w.key("r");
    vec3(w, d.tail<3>());
    w.end_object();
  }
  w.end_array();
}

void reactions(JsonWriter& w, const analysis::FrameModel& model, const analysis::LoadResult& r) {
  std::vector<bool> supported(model.nodes.size(), false);
  for (const auto& s : model.supports) supported[s.node] = true;
  w.key("reactions").begin_array();
  for (std::size_t n = 0; n < model.nodes.size(); ++n) {
    if (!supported[n]) continue;
    const auto f = r.reactions.segment<6>(static_cast<Eigen::Index>(6 * n));
    w.newline();
    w.begin_object();
    w.key("node").value(n);
    w.key("force");
    vec3(w, f.head<3>());
    w.key("moment");
    vec3(w, f.tail<3>());
    w.end_object();
  }
  w.end_array();
}

void member_summaries(JsonWriter& w, const analysis::FrameModel& model, const analysis::LoadResult& r) {
  w.key("members").begin_array();
  for (std::size_t m = 0; m < r.members.size(); ++m) {
    const auto& res = r.members[m];
    w.newline();
    w.begin_object();
    w.key("member").value(m);
    w.key("max_abs_stress").value(res.max_abs_stress);
    w.key("max_von_mises").value(res.max_von_mises);
    w.key("max_local_deflection").value(res.max_local_deflection);
    w.key("end_forces").begin_object();
    w.key("start");
    vec6(w, res.start_forces);
    w.key("end");
    vec6(w, res.end_forces);
    w.end_object();
    if (m < model.members.size() && model.members[m].elements.size() > 1) inner_node_forces(w, model, r, model.members[m]);
    w.end_object();
  }
  w.end_array();
}

// One result; without `details` (outputs.result_details) its node displacements and member summaries
// are left out, and named in "left_out".
void write_result(JsonWriter& w, const analysis::FrameModel& model, const analysis::LoadResult& r, bool details) {
  w.begin_object();
  w.key("name").value(r.name);
  w.key("kind").value(r.is_combination ? "combination" : "case");
  if (r.is_combination) w.key("limit_state").value(r.serviceability ? "sls" : "uls");
  // Elastic critical load factor and the lowest buckling modes' factors (null / empty when not computed).
  if (r.alpha_cr) w.key("alpha_cr").value(*r.alpha_cr);
  else w.key("alpha_cr").null();
  w.key("buckling_factors").begin_array();
  for (const auto& mode : r.buckling_modes) w.value(mode.alpha);
  w.end_array();
  w.key("second_order").value(r.second_order);
  if (details) {
    displacements(w, model, r);
  } else {
    w.key("left_out").begin_array();
    w.value("displacements");
    w.value("members");
    w.end_array();
  }
  reactions(w, model, r);
  if (details) member_summaries(w, model, r);
  w.end_object();
}

}  // namespace

void write_results_json(const Analysis& a, const std::function<void(std::string_view)>& sink) {
  const auto& model = a.built.model;
  JsonWriter w(sink);
  w.begin_object();
  w.key("schema").value("stepframe-results/1");
  w.key("caution").value(caution);
  w.key("units").begin_object();
  for (const auto& [quantity, unit] : {std::pair{"length", "m"}, {"force", "N"}, {"moment", "N*m"}, {"stress", "Pa"},
                                       {"rotation", "rad"}})
    w.key(quantity).value(unit);
  w.end_object();
  w.key("status").value(a.status() == ExitStatus::pass ? "pass" : "fail");
  w.key("model").begin_object();
  w.key("file").value(a.project.model.string());
  w.key("length_unit").value(a.file_length_unit);
  w.end_object();
  w.newline();

  w.key("nodes").begin_array();
  for (std::size_t i = 0; i < model.nodes.size(); ++i) {
    w.newline();
    w.begin_object();
    w.key("id").value(i);
    w.key("xyz");
    vec3(w, model.nodes[i]);
    w.end_object();
  }
  w.end_array();
  w.newline();

  w.key("members").begin_array();
  for (std::size_t i = 0; i < model.members.size(); ++i) {
    const auto& chain = model.members[i].elements;
    const auto& first = model.elements[chain.front()];
    std::vector<std::size_t> path{first.nodes[0]};
    double length = 0;
    for (std::size_t e : chain) {
      const auto& element = model.elements[e];
      path.push_back(element.nodes[1]);
      length += (model.nodes[element.nodes[1]] - model.nodes[element.nodes[0]]).norm();
    }
    w.newline();
    w.begin_object();
    w.key("id").value(i);
    w.key("nodes").begin_array();
    w.value(path.front());
    w.value(path.back());
    w.end_array();
    w.key("path").begin_array();
    for (std::size_t n : path) w.value(n);
    w.end_array();
    w.key("section").value(model.sections[first.section].designation);
    w.key("material").value(model.materials[first.material].name);
    w.key("length").value(length);
    // Mass = A rho L [kg]; local z of the first element (global components, the section's orientation);
    // releases of the member's ends (ux uy uz rx ry rz, local axes): what `compare` tells apart.
    const auto& last = model.elements[chain.back()];
    w.key("mass").value(model.sections[first.section].A * model.materials[first.material].density * length);
    w.key("z_axis");
    vec3(w, analysis::local_axes(model.nodes[first.nodes[0]], model.nodes[first.nodes[1]], first.roll).row(2).transpose());
    w.key("releases").begin_object();
    w.key("start").bools(first.releases[0]);
    w.key("end").bools(last.releases[1]);
    w.end_object();
    if (i < a.shop.marks.size()) {
      w.key("mark").value(a.shop.marks[i]);
      w.key("camber").value(a.shop.camber[i]);
    }
    w.key("source");
    source(w, a.built.member_sources[i]);
    w.end_object();
  }
  w.end_array();
  w.newline();

  // Every combination of the project with its factors; generated ones name the rule that wrote them.
  w.key("combinations").begin_array();
  for (const auto& c : a.project.combinations) {
    w.newline();
    w.begin_object();
    w.key("name").value(c.name);
    w.key("limit_state").value(c.serviceability ? "sls" : "uls");
    if (c.rule.empty()) w.key("rule").null();
    else w.key("rule").value(c.rule);
    if (!c.leading.empty()) w.key("leading").value(c.leading);
    w.key("factors").begin_object();
    for (const auto& [name, factor] : c.factors) w.key(name).value(factor);
    w.end_object();
    w.end_object();
  }
  w.end_array();
  w.newline();

  w.key("supports").begin_array();
  for (const auto& s : model.supports) {
    w.newline();
    w.begin_object();
    w.key("node").value(s.node);
    w.key("fixed").bools(s.fixed);
    w.key("spring").numbers(s.spring);
    w.end_object();
  }
  w.end_array();
  w.newline();

  w.key("results").begin_array();
  const std::vector<bool> details = ResultSelection(a)(a.project.outputs.result_details);
  for (std::size_t i = 0; i < a.results.size(); ++i) {
    w.newline();
    write_result(w, model, a.results[i], details[i]);
  }
  w.end_array();
  w.newline();

  w.key("checks");
  {
    const auto governing = governing_checks(a);
    const bool every = a.project.outputs.check_details == CheckDetails::all;
    write_checks(w, a.checks, [&](const analysis::CheckResult& c) {
      return every || !c.pass || c.member == analysis::whole_frame || c.member >= governing.size() ||
             governing[c.member] == &c;
    });
  }
  w.newline();

  w.key("sway_imperfections").begin_array();
  for (const auto& s : a.sway_imperfections) {
    const auto& i = s.imperfection;
    w.newline();
    w.begin_object();
    w.key("combination").value(s.combination);
    w.key("axis").value(i.axis == 0 ? "X" : "Y");
    w.key("phi").value(i.phi);
    w.key("alpha_h").value(i.alpha_h);
    w.key("alpha_m").value(i.alpha_m);
    w.key("columns").value(i.columns);
    w.key("height").value(i.height);
    w.key("H_Ed").value(i.H_Ed);
    w.key("V_Ed").value(i.V_Ed);
    w.key("exempt").value(i.exempt);
    if (s.alpha_cr) w.key("alpha_cr").value(*s.alpha_cr);
    else w.key("alpha_cr").null();
    w.key("amplification").value(s.amplification);
    w.key("forces").begin_array();  // towards +axis; the -axis variant takes them reversed
    for (const auto& f : i.forces) {
      w.begin_object();
      w.key("node").value(f.node);
      w.key("force");
      vec3(w, f.force);
      w.end_object();
    }
    w.end_array();
    w.key("variants").begin_array();
    for (const auto& v : s.variants) w.value(v);
    w.end_array();
    w.end_object();
  }
  w.end_array();
  w.newline();

  // Area loads: per case and entry, the panels found and the member loads made of them (global axes).
  w.key("area_loads").begin_array();
  {
    const std::vector<std::size_t> member_of = analysis::element_members(model);
    for (std::size_t c = 0; c < a.built.area_loads.size(); ++c)
      for (std::size_t i = 0; i < a.built.area_loads[c].size(); ++i) {
        const auto& area = a.built.area_loads[c][i];
        w.newline();
        w.begin_object();
        w.key("case").value(a.project.cases[c].name);
        w.key("entry").value(i);
        w.key("area").value(area.area);
        w.key("total_force").value(area.total_force);
        w.key("panels").begin_array();
        for (const auto& panel : area.panels) {
          w.newline();
          w.begin_object();
          w.key("area").value(panel.area);
          w.key("method").value(panel.method);
          w.key("outline").begin_array();
          for (const auto& p : panel.outline) vec3(w, p);
          w.end_array();
          w.end_object();
        }
        w.end_array();
        w.key("member_loads").begin_array();
        for (const auto& l : area.loads) {
          w.newline();
          w.begin_object();
          w.key("member").value(member_of[l.load.element]);
          w.key("element").value(l.load.element);
          w.key("panel").value(l.panel);
          w.key("from").value(l.load.a);
          w.key("to").value(l.load.b);
          w.key("w_start");
          vec3(w, l.load.w_start);
          w.key("w_end");
          vec3(w, l.load.w_end);
          w.end_object();
        }
        w.end_array();
        w.end_object();
      }
  }
  w.end_array();
  w.newline();

  // Natural frequencies (analysis.modes): null without them. Shapes are in vtk/mode_N.vtu.
  w.key("modes");
  if (!a.modes) {
    w.null();
  } else {
    const auto& m = *a.modes;
    w.begin_object();
    if (a.project.modes.mass_from) w.key("mass_from").value(*a.project.modes.mass_from);
    else w.key("mass_from").null();
    w.key("total_mass").value(m.total_mass);
    w.key("added_mass").value(a.added_mass);
    w.key("moving_mass");
    vec3(w, Eigen::Vector3d(m.moving_mass[0], m.moving_mass[1], m.moving_mass[2]));
    w.key("parts").value(m.parts);
    w.key("list").begin_array();
    for (std::size_t i = 0; i < m.modes.size(); ++i) {
      const auto& mode = m.modes[i];
      w.newline();
      w.begin_object();
      w.key("number").value(i + 1);
      w.key("frequency").value(mode.frequency);
      w.key("period").value(1.0 / mode.frequency);
      w.key("effective_mass");
      vec3(w, Eigen::Vector3d(mode.effective_mass[0], mode.effective_mass[1], mode.effective_mass[2]));
      w.key("mass_ratio");
      vec3(w, Eigen::Vector3d(mode.mass_ratio[0], mode.mass_ratio[1], mode.mass_ratio[2]));
      w.end_object();
    }
    w.end_array();
    w.end_object();
  }
  w.newline();

  w.key("diagnostics").begin_array();
  for (const auto& d : a.wireframe.diagnostics) {
    w.newline();
    json_shapes::diagnostic(w, d);
  }
  w.end_array();
  w.end_object();
  w.newline();
}

std::string results_json_text(const Analysis& analysis) {
  std::string text;
  write_results_json(analysis, [&](std::string_view piece) { text.append(piece); });
  return text;
}

nlohmann::json results_json(const Analysis& analysis) { return nlohmann::json::parse(results_json_text(analysis)); }

nlohmann::json checks_json(const std::vector<analysis::CheckResult>& checks) {
  std::string text;
  {
    JsonWriter w([&](std::string_view piece) { text.append(piece); });
    write_checks(w, checks, [](const analysis::CheckResult&) { return true; });
  }
  return nlohmann::json::parse(text);
}

}  // namespace stepframe
