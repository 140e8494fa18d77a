// `stepframe sections` through the executable: listing, one section's
// properties in SI units, and the message for an unknown designation.
// Reference values: EN 10365:2017 HE B table for HE 200 B (from memory):
// A = 78.08 cm2, Iy = 5696 cm4, Iz = 2003 cm4, Wel,y = 569.6 cm3, Wpl,y = 642.5 cm3,
// It = 59.28 cm4, Iw = 171.1e3 cm6, Avz = 24.83 cm2, iy = 8.54 cm, mass 61.3 kg/m.

#include "test_helpers.hpp"

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

using namespace stepframe;
using Catch::Matchers::Contains;

TEST_CASE("stepframe sections lists the designations that match a family", "[plugin][cli][sections]") {
  test::ScratchDir scratch;
  const auto r = test::run_stepframe("sections IPE", scratch);
  INFO(r.err);
  CHECK(r.status == 0);
  CHECK_THAT(r.out, Contains("IPE80") && Contains("IPE300") && Contains("IPE600"));
  CHECK_THAT(r.out, !Contains("HEB200"));

  const auto json = test::run_stepframe("sections W12 --json", scratch);
  REQUIRE(json.status == 0);
  const auto list = nlohmann::json::parse(json.out);
  REQUIRE(list["sections"].is_array());
  bool w12x26 = false;
  for (const auto& e : list["sections"]) {
    CHECK(e["family"] == "W");
    if (e["designation"] == "W12X26") w12x26 = e["alias"] == "W310X38.7";
  }
  CHECK(w12x26);
}

TEST_CASE("stepframe sections says the properties come from nominal dimensions", "[plugin][cli][sections]") {
  // Every output that shows catalogue properties carries the caution of the README's
  // "How close section properties are to published tables".
  test::ScratchDir scratch;
  const auto one = test::run_stepframe("sections \"IPE 300\"", scratch);
  REQUIRE(one.status == 0);
  CHECK_THAT(one.out, Contains("computed from nominal dimensions") &&
                          Contains("must be checked against the current edition of the standard"));
  const auto list = test::run_stepframe("sections UPE", scratch);
  REQUIRE(list.status == 0);
  CHECK_THAT(list.out, Contains("computed from nominal dimensions"));
  for (const char* query : {"sections \"IPE 300\" --json", "sections UPE --json"}) {
    INFO(query);
    const auto json = test::run_stepframe(query, scratch);
    REQUIRE(json.status == 0);
    CHECK_THAT(nlohmann::json::parse(json.out)["note"].get<std::string>(),
               Contains("computed from nominal dimensions") && Contains("current edition of the standard"));
  }
}

TEST_CASE("stepframe sections prints one section's properties in SI units", "[plugin][cli][sections]") {
  test::ScratchDir scratch;
  const auto r = test::run_stepframe("sections \"HE 200 B\" --json", scratch);
  INFO(r.err);
  REQUIRE(r.status == 0);
  const auto s = nlohmann::json::parse(r.out);
  for (const char* key : {"designation", "family", "standard", "A", "Iy", "Iz", "J", "Iw", "Wel_y", "Wel_z", "Wpl_y",
                          "Wpl_z", "Avy", "Avz", "iy", "iz", "mass_per_metre"}) {
    INFO(key);
    CHECK(s.contains(key));
  }
  CHECK(s["designation"] == "HEB200");
  CHECK(s["family"] == "HEB");
  CHECK(s["standard"] == "EN 10365:2017");
  CHECK(s["A"].get<double>() == Approx(78.08e-4).epsilon(0.005));
  CHECK(s["Iy"].get<double>() == Approx(5696e-8).epsilon(0.005));
  CHECK(s["Iz"].get<double>() == Approx(2003e-8).epsilon(0.005));
  CHECK(s["Wel_y"].get<double>() == Approx(569.6e-6).epsilon(0.005));
  CHECK(s["Wpl_y"].get<double>() == Approx(642.5e-6).epsilon(0.005));
  CHECK(s["J"].get<double>() == Approx(59.28e-8).epsilon(0.005));
  CHECK(s["Iw"].get<double>() == Approx(171.1e3 * 1e-12).epsilon(0.01));
  CHECK(s["Avz"].get<double>() == Approx(24.83e-4).epsilon(0.005));
  CHECK(s["iy"].get<double>() == Approx(0.0854).epsilon(0.005));
  CHECK(s["mass_per_metre"].get<double>() == Approx(61.3).epsilon(0.005));

  // A shape written with its dimensions needs no catalogue row.
  const auto shs = test::run_stepframe("sections \"SHS 110x110x7\" --json", scratch);
  REQUIRE(shs.status == 0);
  const auto j = nlohmann::json::parse(shs.out);
  CHECK(j["family"] == "SHS");
  CHECK(j["depth"].get<double>() == Approx(0.110));
}

TEST_CASE("stepframe sections suggests the nearest designations for an unknown one", "[plugin][cli][sections]") {
  test::ScratchDir scratch;
  const auto r = test::run_stepframe("sections \"IPE 310\"", scratch);
  CHECK(r.status == 2);
  CHECK_THAT(r.err, Contains("IPE 310") && Contains("IPE300") && Contains("IPE330"));
}

TEST_CASE("stepframe sections prints readable numbers and family names", "[plugin][cli][sections]") {
  // HE 200 B (EN 10365:2017 table, from memory; header of this file): Iw = 171.1e3 cm6, Iy = 5696 cm4.
  test::ScratchDir scratch;
  const auto one = test::run_stepframe("sections \"HE 200 B\"", scratch);
  REQUIRE(one.status == 0);
  CHECK_THAT(one.out, Contains("HEB: wide flange H beams"));
  CHECK_THAT(one.out, Contains("171.1 10^3 cm6") && Contains("5696 cm4") && Contains("78.08 cm2"));
  CHECK_THAT(one.out, Contains("  depth                    200 mm"));  // no trailing zeros
  // Four significant digits, thousands set apart, never an exponent.
  const auto big = test::run_stepframe("sections HEM1000", scratch);
  REQUIRE(big.status == 0);
  CHECK(big.out.find("e+") == std::string::npos);
  CHECK(big.out.find("e-") == std::string::npos);
  CHECK_THAT(big.out, Contains("722 300 cm4"));  // HE 1000 M, Iy = 722 300 cm4 (EN 10365:2017 table, from memory)
  // The listing names each family and counts grammatically.
  const auto list = test::run_stepframe("sections UPN", scratch);
  REQUIRE(list.status == 0);
  CHECK_THAT(list.out, Contains("UPN, channels, tapered flanges (EN 10365") && Contains(" sections\n"));
  const auto json = test::run_stepframe("sections SHS --json", scratch);
  REQUIRE(json.status == 0);
  CHECK(nlohmann::json::parse(json.out)["sections"][0]["family_name"] == "square hollow sections");
}
