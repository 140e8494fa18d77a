// `compare` on revision pairs written here (revision_frames.hpp, invented
// data), each with the diff a person would write down for it: a moved node,
// a changed section, a deleted brace, a split member, a reversed edge (and the
// same without CAD names, so that geometry alone must match), the gate's exit
// statuses, compare.json, compare.html and compare.vtu read back, and
// `run --baseline`.

#include "revision_frames.hpp"
#include "stepframe/compare.hpp"
#include "stepframe/viz/colour_scale.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>
#include <vtkCellData.h>
#include <vtkDataArray.h>
#include <vtkFieldData.h>
#include <vtkNew.h>
#include <vtkStringArray.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridReader.h>

#include <algorithm>
#include <cmath>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

Comparison compare_dirs(const test::ScratchDir& dir, const std::string& a, const std::string& b, CompareOptions o = {}) {
  return compare_revisions(read_revision(dir / a / "frame.yaml"), read_revision(dir / b / "frame.yaml"), o);
}

const MemberDiff& diff_of(const Comparison& c, const std::string& label) {
  const auto it = std::find_if(c.members.begin(), c.members.end(), [&](const auto& d) { return d.label == label; });
  REQUIRE(it != c.members.end());
  return *it;
}

bool has_change(const MemberDiff& d, const std::string& fragment) {
  return std::any_of(d.changes.begin(), d.changes.end(), [&](const auto& c) { return c.find(fragment) != std::string::npos; });
}

std::vector<test::RevisionLine> unnamed(std::vector<test::RevisionLine> lines) {
  for (auto& l : lines) l.name.clear();
  return lines;
}

}  // namespace

TEST_CASE("compare: the same revision twice is unchanged everywhere and passes the gate") {
  test::ScratchDir dir;
  test::write_revision(dir / "a", test::base_revision());
  test::write_revision(dir / "b", test::base_revision());
  const auto c = compare_dirs(dir, "a", "b");
  CHECK(c.count(ChangeKind::unchanged) == 4);
  CHECK(c.members.size() == 4);
  CHECK(c.status() == ExitStatus::pass);
  CHECK(c.new_mass == Approx(c.old_mass));
  CHECK(c.supports.empty());
  CHECK(c.loads.empty());
  for (const auto& d : c.members) {
    CHECK(d.by_identity);
    CHECK(d.before);
    CHECK(*d.after == Approx(*d.before).margin(1e-12));
  }
}

TEST_CASE("compare: a moved node moves every member at it by the node's shift") {
  test::ScratchDir dir;
  test::write_revision(dir / "a", test::base_revision());
  auto lines = test::base_revision();
  const Eigen::Vector3d head(5, 0, 3.3);  // C2's head raised 300 mm
  lines[1].b = head, lines[2].b = head, lines[3].b = head;
  test::write_revision(dir / "b", lines);
  for (bool named : {true, false}) {
    INFO((named ? "matched by CAD name" : "matched by geometry"));
    if (!named) test::write_revision(dir / "a", unnamed(test::base_revision())), test::write_revision(dir / "b", unnamed(lines));
    const auto c = compare_dirs(dir, "a", "b");
    CHECK(c.count(ChangeKind::moved) == 3);
    CHECK(c.count(ChangeKind::unchanged) == 1);
    CHECK(c.count(ChangeKind::added) == 0);
    CHECK(c.count(ChangeKind::removed) == 0);
    for (const auto& d : c.members) {
      if (d.kind != ChangeKind::moved) continue;
      CHECK(d.moved == Approx(0.3).margin(1e-9));
      CHECK(d.by_identity == named);
      CHECK(has_change(d, "moved 300 mm"));
    }
    // Longer column and brace, sloping beam: the mass rises by the added length times the mass per metre.
    CHECK(c.new_mass > c.old_mass);
    // The self-weight case's resultant changed with the lengths (load case G listed).
    CHECK(std::any_of(c.loads.begin(), c.loads.end(), [](const auto& l) { return l.name == "G"; }));
  }
}

TEST_CASE("compare: a changed section is listed with the mass per section and the utilisation it moves") {
  test::ScratchDir dir;
  test::write_revision(dir / "a", test::base_revision(), "IPE300");
  test::write_revision(dir / "b", test::base_revision(), "IPE240");
  const auto c = compare_dirs(dir, "a", "b");
  const auto& beam = diff_of(c, "B1");
  CHECK(beam.kind == ChangeKind::modified);
  CHECK(has_change(beam, "section IPE300 -> IPE240"));
  REQUIRE(beam.before);
  CHECK(*beam.after > *beam.before);  // a lighter beam under the same load works harder
  CHECK(c.count(ChangeKind::modified) == 1);
  // Mass per section: 5 m of IPE 300 (42.2 kg/m) replaced by 5 m of IPE 240 (30.7 kg/m); EN 10365 tables
  // (from memory), our computed A times 7850 kg/m3 within 2 %.
  CHECK(c.mass_by_section.at("IPE300")[0] == Approx(5 * 42.2).epsilon(0.02));
  CHECK(c.mass_by_section.at("IPE300")[1] == 0);
  CHECK(c.mass_by_section.at("IPE240")[1] == Approx(5 * 30.7).epsilon(0.02));
  CHECK(c.new_mass - c.old_mass == Approx(5 * (30.7 - 42.2)).epsilon(0.03));
}

TEST_CASE("compare: a deleted brace is removed, the frame sways more, and the gate fails") {
  test::ScratchDir dir;
  test::write_revision(dir / "a", test::base_revision());
  auto lines = test::base_revision();
  lines.pop_back();
  test::write_revision(dir / "b", lines);
  const auto c = compare_dirs(dir, "a", "b");
  CHECK(c.count(ChangeKind::removed) == 1);
  const auto& brace = diff_of(c, "X1");
  CHECK(brace.kind == ChangeKind::removed);
  CHECK(brace.new_ids.empty());
  CHECK(brace.before);
  CHECK_FALSE(brace.after);
  // Without the brace the 60 kN (factored) sway reaches the far column C2 through the beam and bends it:
  // its utilisation rises well beyond 0.05 and the gate fails naming it.
  const auto& column = diff_of(c, "C2");
  CHECK(column.largest_increase() > 0.05);
  CHECK(c.status() == ExitStatus::check_failed);
  CHECK(std::any_of(c.gate_failures.begin(), c.gate_failures.end(),
                    [](const auto& g) { return g.find("C2") != std::string::npos; }));
  // Failures first: the member at the head of the list has the largest rise (none newly fails here, or it
  // would come first).
  CHECK(c.members.front().largest_increase() >= column.largest_increase());
  // With a threshold above every rise, only what newly fails is left to fail the gate.
  CompareOptions lenient;
  lenient.max_increase = 100;
  const auto l = compare_dirs(dir, "a", "b", lenient);
  CHECK(l.gate_failures.size() < c.gate_failures.size());
  for (const auto& g : l.gate_failures) CHECK_THAT(g, Contains("newly fails"));
}

TEST_CASE("compare: a split beam is one old member covered by two new ones; the other way round it is merged") {
  test::ScratchDir dir;
  test::write_revision(dir / "a", test::base_revision());
  auto lines = test::base_revision();
  lines[2] = {{0, 0, 3}, {2, 0, 3}, "B1a", "BEAMS"};
  lines.push_back({{5, 0, 3}, {2, 0, 3}, "B1b", "BEAMS"});  // the second part drawn from the far end
  test::write_revision(dir / "b", lines);
  for (bool named : {true, false}) {
    INFO((named ? "named" : "unnamed"));
    if (!named) test::write_revision(dir / "a", unnamed(test::base_revision())), test::write_revision(dir / "b", unnamed(lines));
    const auto c = compare_dirs(dir, "a", "b");
    CHECK(c.count(ChangeKind::split) == 1);
    CHECK(c.count(ChangeKind::added) == 0);
    CHECK(c.count(ChangeKind::removed) == 0);
    const auto it = std::find_if(c.members.begin(), c.members.end(), [](const auto& d) { return d.kind == ChangeKind::split; });
    REQUIRE(it != c.members.end());
    CHECK(it->old_ids.size() == 1);
    CHECK(it->new_ids.size() == 2);
    CHECK(has_change(*it, "split into 2 members"));
    CHECK(c.new_mass == Approx(c.old_mass).epsilon(1e-9));  // the same steel, cut in two
    const auto back = compare_dirs(dir, "b", "a");
    CHECK(back.count(ChangeKind::merged) == 1);
    CHECK(back.count(ChangeKind::added) == 0);
  }
}

TEST_CASE("compare: a reversed edge is the same member drawn the other way, nothing else changed") {
  test::ScratchDir dir;
  test::write_revision(dir / "a", test::base_revision());
  auto lines = test::base_revision();
  std::swap(lines[2].a, lines[2].b);
  test::write_revision(dir / "b", lines);
  for (bool named : {true, false}) {
    INFO((named ? "named" : "unnamed"));
    if (!named) test::write_revision(dir / "a", unnamed(test::base_revision())), test::write_revision(dir / "b", unnamed(lines));
    const auto c = compare_dirs(dir, "a", "b");
    CHECK(c.count(ChangeKind::unchanged) == 4);
    CHECK(std::count_if(c.members.begin(), c.members.end(), [](const auto& d) { return d.reversed; }) == 1);
    CHECK(c.status() == ExitStatus::pass);
    // The physics does not depend on the drawing direction: every utilisation the same.
    for (const auto& d : c.members) CHECK(*d.after == Approx(*d.before).epsilon(1e-9));
  }
}

TEST_CASE("compare: the command writes compare.json, compare.html and compare.vtu and gates by exit status") {
  test::ScratchDir dir;
  test::write_revision(dir / "a", test::base_revision());
  auto lines = test::base_revision();
  lines.pop_back();
  test::write_revision(dir / "b", lines);
  test::write_revision(dir / "c", test::base_revision(), "IPE330");  // a heavier beam: nothing worse

  // Results folders on one side, a project run on the spot on the other.
  REQUIRE(test::run_stepframe("run \"" + (dir / "a" / "frame.yaml").string() + "\" --out \"" + (dir / "ra").string() + "\"", dir).status <= 1);
  const auto worse = test::run_stepframe("compare \"" + (dir / "ra").string() + "\" \"" + (dir / "b" / "frame.yaml").string() +
                                             "\" --out \"" + (dir / "cmp").string() + "\"", dir);
  CHECK(worse.status == 1);
  CHECK_THAT(worse.out, Contains("competent engineer") && Contains("1 removed"));
  const auto j = nlohmann::json::parse(test::read_text(dir / "cmp" / "compare.json"));
  CHECK(j["schema"] == "stepframe-compare/1");
  CHECK(j["counts"]["removed"] == 1);
  CHECK(j["exit_status"] == 1);
  REQUIRE(j["members"][0]["change"].is_number());
  CHECK(j["members"][0]["change"].get<double>() > 0);  // failures and the largest rises come first

  const auto html = test::read_text(dir / "cmp" / "compare.html");
  CHECK_THAT(html, Contains("<svg") && Contains("competent engineer") && Contains("What fails the gate"));
  CHECK_THAT(html, Contains(viz::hex(viz::undeformed_colour())));  // the removed brace, dashed where it was

  vtkNew<vtkXMLUnstructuredGridReader> reader;
  reader->SetFileName((dir / "cmp" / "compare.vtu").string().c_str());
  reader->Update();
  auto* grid = reader->GetOutput();
  REQUIRE(grid->GetNumberOfCells() == 4);  // three members of the new revision, the removed brace
  auto* kind = grid->GetCellData()->GetArray("change_kind");
  auto* change = grid->GetCellData()->GetArray("utilisation_change");
  REQUIRE(kind);
  REQUIRE(change);
  int removed = 0;
  double largest = 0;
  for (vtkIdType i = 0; i < 4; ++i) {
    removed += kind->GetTuple1(i) == static_cast<int>(ChangeKind::removed);
    if (std::isfinite(change->GetTuple1(i))) largest = std::max(largest, change->GetTuple1(i));
  }
  CHECK(removed == 1);
  double expected = 0;
  for (const auto& m : j["members"])
    if (m["change"].is_number()) expected = std::max(expected, m["change"].get<double>());
  CHECK(largest == Approx(expected).epsilon(1e-5));  // 32-bit floats in VTK
  CHECK(grid->GetFieldData()->GetAbstractArray("change_kinds") != nullptr);

  const auto better = test::run_stepframe("compare \"" + (dir / "ra" / "results.json").string() + "\" \"" +
                                              (dir / "c" / "frame.yaml").string() + "\" --out \"" + (dir / "cmp2").string() + "\"", dir);
  CHECK(better.status == 0);

  const auto bad = test::run_stepframe("compare \"" + (dir / "nowhere").string() + "\" \"" + (dir / "ra").string() +
                                           "\" --out \"" + (dir / "cmp3").string() + "\"", dir);
  CHECK(bad.status == 2);
  CHECK_THAT(bad.err, Contains("nowhere") && Contains("not found"));
  CHECK_FALSE(std::filesystem::exists(dir / "cmp3"));
}

TEST_CASE("run --baseline compares with the previous results in the same folder and gates the run") {
  test::ScratchDir dir;
  const auto project = test::write_revision(dir / "p", test::base_revision());
  const auto out = dir / "p" / "results";
  REQUIRE(test::run_stepframe("run \"" + project.string() + "\" --out \"" + out.string() + "\"", dir).status == 0);
  // The next revision loses its brace; the baseline is the folder the run is about to replace.
  auto lines = test::base_revision();
  lines.pop_back();
  test::write_revision(dir / "p", lines);
  const auto r = test::run_stepframe("run \"" + project.string() + "\" --out \"" + out.string() + "\" --baseline \"" + out.string() + "\"", dir);
  CHECK(r.status == 1);
  const auto j = nlohmann::json::parse(test::read_text(out / "compare" / "compare.json"));
  CHECK(j["counts"]["removed"] == 1);
  CHECK(j["status"] == "fail");
  CHECK(std::filesystem::exists(out / "results.json"));

  const auto missing = test::run_stepframe("run \"" + project.string() + "\" --out \"" + (dir / "o2").string() +
                                               "\" --baseline \"" + (dir / "nothing").string() + "\"", dir);
  CHECK(missing.status == 2);
  CHECK_FALSE(std::filesystem::exists(dir / "o2"));
}
