// report.html read back against results.json and independent tools: failures
// listed first and completely, values with their limits, reactions,
// calculation sheets with the details, the browser view's data, the inputs'
// SHA-256 (against coreutils' sha256sum, FIPS 180-4), and the colour legends.

#include "portal_project.hpp"
#include "stepframe/analysis/section.hpp"
#include "stepframe/api.hpp"
#include "stepframe/viz/colour_scale.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

#include <regex>

using namespace stepframe;
using Catch::Matchers::Contains;

namespace {

/// The rows of the HTML table with this id (its header row excluded).
std::vector<std::string> table_rows(const std::string& html, const std::string& id) {
  const auto start = html.find("id=\"" + id + "\"");
  REQUIRE(start != std::string::npos);
  const auto end = html.find("</table>", start);
  std::vector<std::string> rows;
  for (auto at = html.find("<tr", start); at < end; at = html.find("<tr", at + 3)) rows.push_back(html.substr(at, html.find("</tr>", at) - at));
  rows.erase(rows.begin());
  return rows;
}

}  // namespace

TEST_CASE("the report lists every failing check first, then the highest passing ones, with values and limits") {
  test::ScratchDir dir;
  test::write_portal(dir, 140);  // 140 kN/m on the 5 m IPE 300 beam: its checks fail, the columns' mostly pass
  const auto r = test::run_stepframe("run \"" + (dir / "portal.yaml").string() + "\" --out \"" + (dir / "out").string() + "\"", dir);
  REQUIRE(r.status == 1);
  const auto html = test::read_text(dir / "out" / "report.html");
  const auto j = nlohmann::json::parse(test::read_text(dir / "out" / "results.json"));
  std::size_t failing = 0;
  for (const auto& c : j["checks"]) failing += c["pass"].get<bool>() ? 0 : 1;
  REQUIRE(failing > 0);

  const auto failed_rows = table_rows(html, "failing-checks");
  CHECK(failed_rows.size() == failing);
  for (const auto& row : failed_rows) CHECK_THAT(row, Contains("class=\"failed\""));
  // Failures come before the passing checks, the pictures and the member table.
  CHECK(html.find("id=\"failing\"") < html.find("id=\"passing\""));
  CHECK(html.find("id=\"passing\"") < html.find("id=\"pictures\""));
  CHECK(html.find("id=\"pictures\"") < html.find("id=\"members\""));
  CHECK_THAT(html, Contains(std::to_string(failing) + " of " + std::to_string(j["checks"].size()) + " checks fail"));

  // The row shows the value and the limit of the worst failing check (MPa for stresses).
  const nlohmann::json* worst = nullptr;
  for (const auto& c : j["checks"])
    if (!c["pass"].get<bool>() && c["member"].is_number() && (!worst || c["utilisation"] > (*worst)["utilisation"])) worst = &c;
  REQUIRE(worst);
  std::smatch m;
  // Frame-level failures lead the table; the worst member check's row is found by its member and check.
  CHECK_THAT(failed_rows.front(), Contains("whole frame"));
  const std::string member_link = "#sheet-" + std::to_string((*worst)["member"].get<std::size_t>()) + "\"";
  const auto row = std::find_if(failed_rows.begin(), failed_rows.end(), [&](const std::string& text) {
    return text.find(member_link) != std::string::npos && text.find(">" + (*worst)["check"].get<std::string>() + "<") != std::string::npos;
  });
  REQUIRE(row != failed_rows.end());
  const std::string& first = *row;
  INFO(first);
  REQUIRE(std::regex_search(first, m, std::regex("<td class=\"num\">([0-9.]+)</td><td class=\"num\">([0-9.]+) *([A-Za-z·]*)</td><td class=\"num\">([0-9.]+) *([A-Za-z·]*)</td><td class=\"num\">([0-9.]+)</td>")));
  CHECK(std::stod(m[6]) == Approx((*worst)["utilisation"].get<double>()).margin(5e-4));
  CHECK(std::stod(m[2]) / std::stod(m[4]) == Approx((*worst)["utilisation"].get<double>()).epsilon(2e-3));

  SECTION("calculation sheets carry each check's details as results.json does") {
    const std::string anchor = "id=\"sheet-" + std::to_string((*worst)["member"].get<std::size_t>()) + "\"";
    const auto sheet = html.find(anchor);
    REQUIRE(sheet != std::string::npos);
    const auto sheet_end = html.find("</section>", sheet);
    const std::string text = html.substr(sheet, sheet_end - sheet);
    std::size_t with_details = 0;
    for (const auto& c : j["checks"])
      if (c["member"] == (*worst)["member"] && c.contains("details"))
        for (const auto& [name, value] : c["details"].items()) {
          CHECK_THAT(text, Contains("<td>" + name + "</td>"));
          ++with_details;
        }
    // Every check of the member is on its sheet with its clause.
    for (const auto& c : j["checks"])
      if (c["member"] == (*worst)["member"]) CHECK_THAT(text, Contains(c["check"].get<std::string>() + " — utilisation"));
    CHECK(text.find("FAILS") != std::string::npos);
    // The cross-section check's resistances: N_Rd = A fy / gamma_M0 (EN 1993-1-1 (6.10)), IPE 300 in S355.
    const auto ipe300 = analysis::find_catalogue_section("IPE300");
    REQUIRE(ipe300);
    bool seen = false;
    for (const auto& c : j["checks"])
      if (c["member"] == (*worst)["member"] && c["check"] == "6.2 cross-section") {
        seen = true;
        CHECK(c["details"]["N_Rd"].get<double>() == Approx(ipe300->A * 355e6).epsilon(1e-9));
        CHECK(c["details"]["class"].get<double>() == 1);  // IPE 300 in bending: class 1 (EN 1993-1-1 Table 5.2, common practice)
        CHECK_THAT(text, Contains("<td>N_Rd</td>"));
      }
    CHECK(seen);
  }

  SECTION("reactions as in results.json (kN)") {
    const auto rows = table_rows(html, "reactions-table");
    REQUIRE(rows.size() == 2 * j["results"].size());  // two supported nodes
    const auto& first_reaction = j["results"][0]["reactions"][0];
    REQUIRE(std::regex_search(rows[0], m, std::regex("<td>([0-9]+)</td><td>[^<]*</td>(?:<td class=\"num\">[^<]*</td>){2}<td class=\"num\">([-0-9.e]+)</td>")));
    CHECK(std::stoul(m[1]) == first_reaction["node"].get<std::size_t>());
    CHECK(std::stod(m[2]) == Approx(first_reaction["force"][2].get<double>() / 1e3).epsilon(1e-3));
  }

  SECTION("the browser view's data: every member's governing utilisation and the shared colour scale") {
    const auto start = html.find("<script type=\"application/json\" id=\"sf-view-data\">");
    REQUIRE(start != std::string::npos);
    const auto body = start + std::string("<script type=\"application/json\" id=\"sf-view-data\">").size();
    const auto view = nlohmann::json::parse(html.substr(body, html.find("</script>", body) - body));
    REQUIRE(view["members"].size() == j["members"].size());
    std::vector<double> governing(j["members"].size(), 0.0);
    for (const auto& c : j["checks"])
      if (c["member"].is_number())
        governing[c["member"].get<std::size_t>()] = std::max(governing[c["member"].get<std::size_t>()], c["utilisation"].get<double>());
    for (std::size_t i = 0; i < governing.size(); ++i) CHECK(view["members"][i]["u"].get<double>() == Approx(governing[i]).epsilon(1e-4));
    CHECK(view["scales"]["utilisation"].back() == viz::hex(viz::utilisation_colour(1.0)));
    CHECK(view["scales"]["above_limit"] == viz::hex(viz::above_limit_colour()));
    CHECK(view["results"].size() == j["results"].size());
    CHECK_THAT(html, Contains("MIT License"));  // three.js's licence travels with it
  }

  SECTION("pictures: labelled members, horizontal legends with the above-limit entry") {
    CHECK_THAT(html, Contains("id=\"picture-utilisation\"") && Contains("id=\"picture-deformed\"") &&
                         Contains("id=\"picture-stress\""));
    CHECK_THAT(html, Contains("Deformed shape under SLS (the serviceability result of the governing deflection check)"));
    CHECK_THAT(html, Contains("above limit (over 1.0)") && Contains("class=\"label\""));
  }

  SECTION("inputs: version, the files' SHA-256 against sha256sum, supports found, loads with their magnitudes") {
    const auto sums =
        test::run_shell("sha256sum \"" + (dir / "portal.yaml").string() + "\" \"" + (dir / "portal.stp").string() + "\"", dir).out;
    REQUIRE(sums.size() > 128);
    CHECK_THAT(html, Contains("SHA-256 " + sums.substr(0, 64)));
    CHECK_THAT(html, Contains("SHA-256 " + sums.substr(sums.find('\n') + 1, 64)));
    CHECK_THAT(html, Contains("Supports found (2 nodes)"));
    CHECK_THAT(html, Contains("line load (0, 0, -140.0) kN/m (global axes) on layer ~ BEAMS"));
    CHECK_THAT(html, Contains("node force (8.000, 0, 0) kN"));
    CHECK_THAT(html, Contains("<td>IPE300</td><td>IPE</td><td>S355</td>"));
    const auto absolute = html.find(dir.path().string());
    INFO(html.substr(absolute == std::string::npos ? 0 : absolute - std::min<std::size_t>(absolute, 200), 300));
    CHECK(absolute == std::string::npos);  // no absolute paths
  }
}

TEST_CASE("the members table lists the 1,000 most utilised members and every failing one; checks.csv every member") {
  // A continuous beam of 1,100 spans of 1 m (invented test data), every node held: 1,100 members.
  test::ScratchDir dir;
  std::vector<geometry::LineToWrite> spans;
  for (int i = 0; i < 1100; ++i) spans.push_back({{double(i), 0, 0}, {double(i + 1), 0, 0}, {}});
  geometry::write_step_wireframe(dir / "beam.stp", spans, "mm");
  auto report = [&](double load_kN_per_m) {
    const std::string project = "model: beam.stp\n"
                                "units: {length: m, force: kN, line_load: kN/m}\n"
                                "rules: [{where: {}, section: IPE300, material: S355}]\n"
                                "supports: [{where: {z: 0}, fix: [ux, uy, uz, rx]}]\n"
                                "cases: [{name: G, member_loads: [{where: {}, w: [0, 0, -" +
                                std::to_string(load_kN_per_m) + "]}]}]\n"
                                "analysis: {buckling_modes: 0}\n"
                                "checks: {stress: {}}\n";
    RunOptions options;
    options.out_dir = dir / "out";
    std::filesystem::remove_all(options.out_dir);
    const Results results = run_text(project, dir.path(), options);
    INFO(results.message());
    REQUIRE(results.analysed());
    CHECK(test::read_text(dir / "out" / "checks.csv").find("\n1099,") != std::string::npos);  // every member
    return test::read_text(dir / "out" / "report.html");
  };
  SECTION("all pass: the 1,000 most utilised, and where the rest are") {
    const auto html = report(10);
    const auto rows = table_rows(html, "members-table");
    CHECK(rows.size() == 1000);
    for (const auto& row : rows) CHECK_THAT(row, !Contains("class=\"failed\""));
    CHECK_THAT(html, Contains("The 1000 most utilised and every failing one of 1100 members; checks.csv lists every member"));
  }
  SECTION("all fail: every failing member is listed") {
    // 5,000 kN/m on 1 m spans: about wL^2/12 = 417 kN*m against fy Wel = 198 kN*m (IPE 300, S355; Wel = 557 cm^3 from memory): all fail.
    const auto html = report(5000);
    const auto rows = table_rows(html, "members-table");
    CHECK(rows.size() == 1100);
    for (const auto& row : rows) CHECK_THAT(row, Contains("class=\"failed\""));
    CHECK_THAT(html, !Contains("most utilised and every failing one"));
  }
}

TEST_CASE("text of the project in the browser view cannot end its script early") {
  // A case named with "</script>" in it (invented test data): inside <script> the sequence "</" would end
  // the element (HTML 4.01 B.3.2; the HTML standard's script data state), so it is written "<\/", which
  // JSON reads back as "</" (RFC 8259, section 7: a backslash before the solidus escapes it).
  test::ScratchDir dir;
  geometry::write_step_wireframe(dir / "beam.stp", {{{0, 0, 0}, {4, 0, 0}, {}}}, "mm");
  const std::string project = "model: beam.stp\n"
                              "units: {length: m, force: kN, line_load: kN/m}\n"
                              "rules: [{where: {}, section: IPE300, material: S355}]\n"
                              "supports: [{where: {x: 0}, fix: fixed}]\n"
                              "cases: [{name: \"G</script><b>x\", member_loads: [{where: {}, w: [0, 0, -5]}]}]\n"
                              "analysis: {buckling_modes: 0}\n"
                              "checks: {stress: {}}\n";
  RunOptions options;
  options.out_dir = dir / "out";
  const Results results = run_text(project, dir.path(), options);
  INFO(results.message());
  REQUIRE(results.analysed());
  const std::string html = test::read_text(dir / "out" / "report.html");
  const std::string open = "<script type=\"application/json\" id=\"sf-view-data\">";
  const auto start = html.find(open);
  REQUIRE(start != std::string::npos);
  const auto body = start + open.size();
  const std::string data = html.substr(body, html.find("</script>", body) - body);
  CHECK_THAT(data, Contains("G<\\/script><b>x"));
  const auto view = nlohmann::json::parse(data);  // the whole data up to the script's real end
  REQUIRE(view["results"].size() == 1);
  CHECK(view["results"][0]["name"] == "G</script><b>x");
}
