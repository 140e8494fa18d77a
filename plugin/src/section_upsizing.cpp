// Section suggestions, round by round until nothing changes (section_upsizing.hpp).

#include "stepframe/section_upsizing.hpp"

#include "output_folder.hpp"
#include "stepframe/analysis/section.hpp"

#include <fmt/format.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <cerrno>
#include <fstream>
#include <map>
#include <set>

namespace stepframe {
namespace {

// A regular expression matching exactly `text` (the selectors match the whole value).
std::string exactly(const std::string& text) {
  std::string out;
  for (char c : text) {
    if (std::string_view("\\^$.|?*+()[]{}").find(c) != std::string_view::npos) out += '\\';
    out += c;
  }
  return out;
}

std::string joined_layers(const std::vector<std::string>& layers) {
  std::string out;
  for (const auto& l : layers) out += (out.empty() ? "" : ", ") + l;
  return out;
}

struct Group {
  std::string label;
  MemberSelector where;
  std::vector<std::size_t> members;
};

// Design groups: members sharing a CAD name; unnamed ones by product, (first) layer and colour.
std::vector<Group> design_groups(const BuiltModel& built) {
  std::vector<Group> groups;
  std::map<std::string, std::size_t> index;
  for (std::size_t m = 0; m < built.member_sources.size(); ++m) {
    const auto& s = built.member_sources[m];
    std::string key;
    Group g;
    if (!s.name.empty()) {
      key = "n\x1f" + s.name;
      g.label = "name '" + s.name + "'";
      g.where.name = exactly(s.name);
    } else {
      key = "a\x1f" + s.product + "\x1f" + joined_layers(s.layers) + "\x1f" + s.colour;
      g.label = "unnamed members of product '" + s.product + "', layers '" + joined_layers(s.layers) + "'";
      if (!s.product.empty()) g.where.product = exactly(s.product);
      if (!s.layers.empty()) g.where.layer = exactly(s.layers.front());
      if (!s.colour.empty()) g.where.colour = exactly(s.colour);
    }
    const auto [it, added] = index.try_emplace(key, groups.size());
    if (added) groups.push_back(std::move(g));
    groups[it->second].members.push_back(m);
  }
  return groups;
}

struct Candidate {
  std::string designation;
  analysis::Section section;
};

// The sections a group may take, lightest first (by area: the same material's mass per metre).
std::vector<Candidate> candidates_for(const std::string& family, const std::vector<std::string>& allowed) {
  std::vector<Candidate> out;
  std::set<std::string> seen;
  auto add = [&](const std::string& designation) {
    if (!seen.insert(designation).second) return;
    if (auto s = analysis::find_catalogue_section(designation)) out.push_back({designation, std::move(*s)});
  };
  for (const auto& e : analysis::catalogue_entries())
    if (allowed.empty() ? e.family == family
                        : std::find(allowed.begin(), allowed.end(), e.family) != allowed.end() ||
                              std::find(allowed.begin(), allowed.end(), e.designation) != allowed.end())
      add(e.designation);
  std::stable_sort(out.begin(), out.end(), [](const Candidate& a, const Candidate& b) { return a.section.A < b.section.A; });
  return out;
}

// The largest improvement a change of section can bring to any check: the largest ratio of area, section
// moduli and second moments (an optimistic estimate, so that the first pick is never heavier than needed;
// the re-analysis corrects it upwards).
double best_gain(const analysis::Section& from, const analysis::Section& to) {
  double gain = 0;
  for (auto [a, b] : {std::pair{from.A, to.A}, {from.Wy(), to.Wy()}, {from.Wz(), to.Wz()}, {from.Iy, to.Iy}, {from.Iz, to.Iz}})
    if (a > 0) gain = std::max(gain, b / a);
  return gain;
}

// Checks a section cannot fix.
bool section_cannot_fix(const analysis::CheckResult& c) {
  return c.member == analysis::whole_frame || c.check == "handling length";
}

double total_mass(const analysis::FrameModel& model) {
  double mass = 0;
  for (const auto& e : model.elements)
    mass += model.sections[e.section].A * model.materials[e.material].density *
            (model.nodes[e.nodes[1]] - model.nodes[e.nodes[0]]).norm();  // kg = A rho L
  return mass;
}

}  // namespace

Suggestion suggest_sections(const Project& project, const geometry::StepModel& step, const Analysis& first,
                            const SuggestOptions& options, const RunControl& control) {
  const auto groups = design_groups(first.built);
  const auto& model0 = first.built.model;
  const std::optional<double> lighten_below = options.lighten_below ? options.lighten_below : project.suggest.lighten_below;

  struct State {
    std::vector<Candidate> candidates;
    std::size_t at = 0;          // index into candidates of the current section
    std::string original;
    bool locked_down = false;    // may not be lightened any more (it was upsized, or a lighter one failed)
    std::size_t round = 0;
    double before = 0;
  };
  std::vector<State> states(groups.size());
  for (std::size_t g = 0; g < groups.size(); ++g) {
    const auto& section = model0.sections[model0.elements[model0.members[groups[g].members.front()].elements.front()].section];
    auto& st = states[g];
    st.original = section.designation;
    st.candidates = candidates_for(section.family, project.suggest.sections);
    const auto it = std::find_if(st.candidates.begin(), st.candidates.end(),
                                 [&](const Candidate& c) { return c.designation == section.designation; });
    if (it == st.candidates.end()) {
      // A section outside the candidates (another family, a custom section): it is the start, and only
      // candidates may replace it.
      st.candidates.insert(st.candidates.begin(), Candidate{section.designation, section});
      st.at = 0;
    } else {
      st.at = static_cast<std::size_t>(it - st.candidates.begin());
    }
  }

  std::vector<std::vector<std::size_t>> member_group(model0.members.size());
  for (std::size_t g = 0; g < groups.size(); ++g)
    for (std::size_t m : groups[g].members) member_group[m].push_back(g);
  auto group_utilisations = [&](const Analysis& a) {
    std::vector<double> u(groups.size(), 0.0);
    for (const auto& c : a.checks)
      if (!section_cannot_fix(c) && c.member < member_group.size())
        for (std::size_t g : member_group[c.member]) u[g] = std::max(u[g], c.utilisation);
    return u;
  };

  Suggestion s;
  s.mass_before = total_mass(model0);
  {
    const auto u0 = group_utilisations(first);
    for (std::size_t g = 0; g < groups.size(); ++g) states[g].before = u0[g];
  }
  Analysis current = first;
  std::vector<double> u = group_utilisations(current);
  std::vector<std::size_t> tried_down;  // groups lightened in the previous round
  for (std::size_t round = 1; round <= options.max_rounds; ++round) {
    control.report("suggest", static_cast<double>(round - 1) / static_cast<double>(options.max_rounds));
    SuggestionRound record;
    record.round = round;
    std::vector<std::size_t> lightened;
    // A group lightened last round that now fails goes back and stays.
    for (std::size_t g : tried_down)
      if (u[g] > 1) {
        auto& st = states[g];
        record.changes.push_back(fmt::format("{}: {} -> {} (the lighter one failed)", groups[g].label,
                                             st.candidates[st.at].designation, st.candidates[st.at + 1].designation));
        ++st.at, st.locked_down = true, st.round = round;
        u[g] = 0;  // handled
      }
    for (std::size_t g = 0; g < groups.size(); ++g) {
      auto& st = states[g];
      if (u[g] > 1) {
        // The lightest heavier candidate that the optimistic estimate lets pass, else the heaviest.
        std::optional<std::size_t> pick;
        for (std::size_t k = st.at + 1; k < st.candidates.size() && !pick; ++k)
          if (u[g] / best_gain(st.candidates[st.at].section, st.candidates[k].section) <= 1) pick = k;
        if (!pick && st.at + 1 < st.candidates.size()) pick = st.candidates.size() - 1;
        if (!pick) continue;  // already the heaviest: unresolved
        record.changes.push_back(fmt::format("{}: {} -> {}", groups[g].label, st.candidates[st.at].designation,
                                             st.candidates[*pick].designation));
        st.at = *pick, st.locked_down = true, st.round = round;
      }
    }
    // Lightening only once nothing fails: one size at a time, groups used below the threshold.
    const bool none_failing = std::none_of(u.begin(), u.end(), [](double v) { return v > 1; }) && record.changes.empty();
    if (none_failing && lighten_below)
      for (std::size_t g = 0; g < groups.size(); ++g) {
        auto& st = states[g];
        if (st.locked_down || st.at == 0 || u[g] >= *lighten_below) continue;
        record.changes.push_back(fmt::format("{}: {} -> {} (used {:.2f})", groups[g].label, st.candidates[st.at].designation,
                                             st.candidates[st.at - 1].designation, u[g]));
        --st.at, st.round = round;
        lightened.push_back(g);
      }
    if (record.changes.empty()) {
      s.settled = true;
      break;
    }
    // Re-analyse with every group's current section as a rule after the project's own.
    Project trial = project;
    for (std::size_t g = 0; g < groups.size(); ++g) {
      const auto& st = states[g];
      if (st.candidates[st.at].designation == st.original) continue;
      Rule rule;
      rule.where = groups[g].where;
      rule.section = st.candidates[st.at].designation;
      trial.rules.push_back(rule);
    }
    spdlog::info("suggest: round {}: {} change(s), analysing again", round, record.changes.size());
    current = analyse_model(trial, step, control);
    u = group_utilisations(current);
    record.failing_after = static_cast<std::size_t>(
        std::count_if(current.checks.begin(), current.checks.end(), [](const auto& c) { return !c.pass; }));
    s.rounds.push_back(std::move(record));
    tried_down = std::move(lightened);
  }
  if (!s.settled) spdlog::warn("suggest: not settled after {} rounds; the last sections are reported", options.max_rounds);

  for (std::size_t g = 0; g < groups.size(); ++g) {
    const auto& st = states[g];
    if (st.candidates[st.at].designation == st.original) continue;
    s.changes.push_back({groups[g].label, groups[g].where, groups[g].members, st.original, st.candidates[st.at].designation,
                         st.before, u[g], st.round});
  }
  for (const auto& c : current.checks)
    if (!c.pass) {
      if (c.member == analysis::whole_frame) s.unresolved.push_back(fmt::format("frame: {} under {}", c.check, c.combination));
      else if (section_cannot_fix(c) || u[member_group[c.member].front()] > 1)
        s.unresolved.push_back(fmt::format("member {}: {} ({:.2f})", c.member, c.check, c.utilisation));
    }
  s.all_pass = current.status() == ExitStatus::pass;
  s.mass_after = total_mass(current.built.model);
  return s;
}

std::string suggestion_yaml(const Suggestion& s) {
  std::string out = fmt::format(
      "# stepframe suggest: {}\n# Mass {:.1f} kg -> {:.1f} kg ({:+.1f} kg). Paste these rules at the end of the "
      "project's rules: (a later rule wins).\n# {}\n",
      s.all_pass ? "with these sections every check passes" : "some checks still fail (see suggest.json)", s.mass_before,
      s.mass_after, s.mass_after - s.mass_before, caution);
  if (s.changes.empty()) return out + "# No section needs to change.\nrules: []\n";
  out += "rules:\n";
  auto quoted = [](const std::string& v) {
    std::string q = "\"";
    for (char c : v) q += c == '"' || c == '\\' ? std::string("\\") + c : std::string(1, c);
    return q + "\"";
  };
  for (const auto& c : s.changes) {
    std::string where;
    auto add = [&](const char* key, const std::optional<std::string>& v) {
      if (v) where += std::string(where.empty() ? "" : ", ") + key + ": " + quoted(*v);
    };
    add("name", c.where.name);
    add("layer", c.where.layer);
    add("product", c.where.product);
    add("colour", c.where.colour);
    out += fmt::format("  - where: {{{}}}\n    section: {}   # was {}; utilisation {:.2f} -> {:.2f}\n", where, c.to, c.from,
                       c.utilisation_before, c.utilisation_after);
  }
  return out;
}

nlohmann::json suggestion_json(const Suggestion& s) {
  nlohmann::json j{{"schema", "stepframe-suggest/1"},
                   {"caution", caution},
                   {"status", s.all_pass ? "pass" : "fail"},
                   {"settled", s.settled},
                   {"mass", {{"before", s.mass_before}, {"after", s.mass_after}, {"change", s.mass_after - s.mass_before}}},
                   {"changes", nlohmann::json::array()},
                   {"rounds", nlohmann::json::array()},
                   {"unresolved", s.unresolved}};
  for (const auto& c : s.changes)
    j["changes"].push_back({{"group", c.group}, {"members", c.members}, {"from", c.from}, {"to", c.to},
                            {"utilisation_before", c.utilisation_before}, {"utilisation_after", c.utilisation_after},
                            {"round", c.round}});
  for (const auto& r : s.rounds)
    j["rounds"].push_back({{"round", r.round}, {"changes", r.changes}, {"failing_after", r.failing_after}});
  return j;
}

std::string suggestion_text(const Suggestion& s) {
  std::string out = fmt::format("suggest: {} after {} round(s){}\n",
                                s.all_pass ? "every check passes" : "checks still fail", s.rounds.size(),
                                s.settled ? "" : " (not settled)");
  for (const auto& c : s.changes)
    out += fmt::format("  {}: {} -> {} (utilisation {:.2f} -> {:.2f})\n", c.group, c.from, c.to, c.utilisation_before,
                       c.utilisation_after);
  for (const auto& u : s.unresolved) out += "  unresolved: " + u + "\n";
  out += fmt::format("mass: {:.1f} kg -> {:.1f} kg ({:+.1f} kg)\n", s.mass_before, s.mass_after, s.mass_after - s.mass_before);
  return out;
}

std::vector<std::filesystem::path> write_suggestion(const Suggestion& s, const std::filesystem::path& out_dir) {
  const detail::OutputFolderLock lock(out_dir);
  detail::StagingFolder staging(out_dir);
  const auto& dir = staging.path();
  std::error_code ignored;
  std::filesystem::remove(dir / "vtk", ignored);
  for (const auto& [name, text] : {std::pair<std::string, std::string>{"suggest.yaml", suggestion_yaml(s)},
                                   {"suggest.json", suggestion_json(s).dump(1) + "\n"}}) {
    std::ofstream out(dir / name, std::ios::binary);
    out << text;
    if (!out.flush()) throw detail::output_failure(out_dir / name, errno);
  }
  staging.commit();
  return {out_dir / "suggest.yaml", out_dir / "suggest.json"};
}

}  // namespace stepframe
