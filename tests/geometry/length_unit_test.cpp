#include "stepframe/geometry/length_unit.hpp"

#include <catch2/catch.hpp>

namespace sg = stepframe::geometry;

TEST_CASE("length units in metres", "[units]") {
  // SI prefixes (SI Brochure, 9th ed., table 7).
  CHECK(*sg::metres_per_unit("mm") == 1e-3);
  CHECK(*sg::metres_per_unit("cm") == 1e-2);
  CHECK(*sg::metres_per_unit("m") == 1.0);
  CHECK(*sg::metres_per_unit("km") == 1e3);
  // International yard and pound agreement (1959): 1 yd = 0.9144 m exactly,
  // so 1 in = 0.0254 m, 1 ft = 0.3048 m, 1 mile = 1760 yd = 1609.344 m.
  CHECK(*sg::metres_per_unit("inch") == 0.0254);
  CHECK(*sg::metres_per_unit("ft") == 0.3048);
  CHECK(*sg::metres_per_unit("mile") == Approx(1760 * 0.9144).epsilon(1e-15));
  CHECK_FALSE(sg::metres_per_unit("furlong").has_value());
  CHECK_FALSE(sg::metres_per_unit("MM").has_value());  // short names are exact
}

TEST_CASE("STEP spellings of length units map to short names", "[units]") {
  CHECK(sg::short_length_unit_name("MILLIMETRE") == "mm");
  CHECK(sg::short_length_unit_name(".MILLI. .METRE.") == "mm");
  CHECK(sg::short_length_unit_name("metre") == "m");
  CHECK(sg::short_length_unit_name("INCH") == "inch");
  CHECK(sg::short_length_unit_name("foot") == "ft");
  CHECK_FALSE(sg::short_length_unit_name("RADIAN").has_value());
}
