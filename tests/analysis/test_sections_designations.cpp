// Designations as people type them, and suggestions for unknown ones. The
// spellings are those in common use on drawings (common practice).

#include "stepframe/analysis/section.hpp"

#include <catch2/catch.hpp>

#include <algorithm>

using namespace stepframe::analysis;

TEST_CASE("canonical spelling of designations", "[analysis][designation]") {
  CHECK(normalize_designation("IPE 300") == "IPE300");
  CHECK(normalize_designation("ipe-300") == "IPE300");
  CHECK(normalize_designation(" ipe_300 ") == "IPE300");
  CHECK(normalize_designation("I.P.E. 300") == "IPE300");
  CHECK(normalize_designation("HE 200 B") == "HEB200");
  CHECK(normalize_designation("HE200B") == "HEB200");
  CHECK(normalize_designation("HEB200") == "HEB200");
  CHECK(normalize_designation("he-200-a") == "HEA200");
  CHECK(normalize_designation("CHS 168.3x5") == "CHS168.3X5");  // decimal point kept
  CHECK(normalize_designation("W12x26") == "W12X26");
  CHECK(normalize_designation("HSS6.625x.280") == "HSS6.625X0.280");
  CHECK(normalize_designation("SHS 100*100*5") == "SHS100X100X5");
  CHECK(normalize_designation("SHS 100\xC3\x97" "100\xC3\x97" "5") == "SHS100X100X5");  // multiplication sign
}

TEST_CASE("every spelling of one section finds the same row", "[analysis][designation]") {
  const auto groups = {
      std::pair{"IPE300", std::vector<const char*>{"IPE 300", "IPE300", "ipe-300", "Ipe 300"}},
      std::pair{"HEB200", std::vector<const char*>{"HE 200 B", "HE200B", "HEB200", "heb 200"}},
      std::pair{"W12X26", std::vector<const char*>{"W12X26", "W12x26", "W310x38.7", "w 12 x 26"}},
      std::pair{"W16X31", std::vector<const char*>{"W16x31", "W410x46.1"}},
      std::pair{"SHS100X100X5", std::vector<const char*>{"SHS 100x100x5", "SHS100X100X5", "SHS 100x5", "shs-100x100x5 CF"}},
      std::pair{"RHS200X100X6.3", std::vector<const char*>{"RHS 200x100x6.3", "rhs200x100x6.3"}},
      std::pair{"CHS219.1X8", std::vector<const char*>{"CHS 219.1x8", "CHS219.1X8.0"}},
      std::pair{"L100X100X10", std::vector<const char*>{"L100x100x10", "L 100 x 100 x 10"}},
      std::pair{"L150X100X10", std::vector<const char*>{"L150x100x10", "L100x150x10"}},
      std::pair{"HSS6X6X3/8", std::vector<const char*>{"HSS6x6x3/8", "HSS 6 x 6 x 3/8"}},
      std::pair{"PL20X300", std::vector<const char*>{"PL20x300", "PL 300x20", "FL20x300"}},
  };
  for (const auto& [canonical, spellings] : groups) {
    for (const char* spelling : spellings) {
      const auto s = find_catalogue_section(spelling);
      INFO(spelling);
      REQUIRE(s);
      CHECK(s->designation == canonical);
    }
  }
}

TEST_CASE("shapes written with their dimensions are computed without a catalogue row", "[analysis][designation]") {
  // Not in data/sections: computed from the designation.
  const auto shs = find_catalogue_section("SHS 110x110x7");
  REQUIRE(shs);
  CHECK(shs->designation == "SHS110X110X7");
  CHECK(shs->family == "SHS");
  CHECK(shs->standard == "EN 10219-2:2006");
  CHECK(shs->depth == Approx(0.110));
  CHECK(shs->t_max == Approx(0.007));
  const auto chs = find_catalogue_section("CHS 200x7.1 HF");
  REQUIRE(chs);
  CHECK(chs->standard == "EN 10210-2:2006");
  // Annulus: A = pi (D^2 - d^2) / 4 (elementary geometry).
  CHECK(chs->A == Approx(3.14159265358979 * (0.2 * 0.2 - 0.1858 * 0.1858) / 4));
  const auto angle = find_catalogue_section("L110x110x11");
  REQUIRE(angle);
  CHECK(angle->shape == SectionShape::angle);
  CHECK(angle->t_max == Approx(0.011));
  const auto hss = find_catalogue_section("HSS7x5x5/16");
  REQUIRE(hss);
  CHECK(hss->t_max == Approx(0.93 * 5.0 / 16 * 0.0254));  // AISC 360 B4.2 design wall
  const auto round = find_catalogue_section("HSS5x0.25");
  REQUIRE(round);
  CHECK(round->shape == SectionShape::chs);
}

TEST_CASE("names that are not sections give nothing", "[analysis][designation]") {
  for (const char* name : {"IPE 310", "HEB 210", "", "BEAMS", "COLUMN 1", "W12X27", "HSS6x6x3", "SHS 100x100x60",
                           "CHS 100x60", "L100", "PL20"}) {
    INFO(name);
    CHECK_FALSE(find_catalogue_section(name));
  }
}

TEST_CASE("unknown designations suggest the nearest known ones", "[analysis][designation]") {
  const auto ipe = nearest_designations("IPE 310", 3);
  REQUIRE(ipe.size() == 3);
  CHECK(ipe[0] == "IPE300");
  CHECK(ipe[1] == "IPE330");
  const auto heb = nearest_designations("HEB 210", 2);
  REQUIRE(heb.size() == 2);
  CHECK(std::find(heb.begin(), heb.end(), "HEB200") != heb.end());
  CHECK(std::find(heb.begin(), heb.end(), "HEB220") != heb.end());
  const auto w = nearest_designations("W12X27", 1);
  REQUIRE(w.size() == 1);
  CHECK(w[0] == "W12X26");
  CHECK(nearest_designations("completely unrelated words", 3).empty());
}

TEST_CASE("catalogue search by family and prefix", "[analysis][designation]") {
  const auto ipe = search_catalogue("IPE");
  CHECK(ipe.size() >= 18);
  CHECK(std::all_of(ipe.begin(), ipe.end(), [](const CatalogueEntry& e) { return e.designation.rfind("IPE", 0) == 0; }));
  const auto heb2 = search_catalogue("heb 2");
  CHECK(heb2.size() == 5);  // HEB200, 220, 240, 260, 280
  const auto w310 = search_catalogue("W310");
  REQUIRE_FALSE(w310.empty());
  CHECK(std::all_of(w310.begin(), w310.end(), [](const CatalogueEntry& e) { return e.designation.rfind("W12X", 0) == 0; }));
  CHECK(search_catalogue("").size() == catalogue_entries().size());
}
