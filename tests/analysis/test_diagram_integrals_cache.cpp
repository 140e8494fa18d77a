// Mcr integrals shared by members whose stations lie at the same positions.

#include "stepframe/analysis/diagram_integrals_cache.hpp"

#include <catch2/catch.hpp>

#include <thread>
#include <vector>

using namespace stepframe::analysis::en1993;

namespace {

std::vector<double> stations(double length, int count) {
  std::vector<double> x;
  for (int k = 0; k < count; ++k) x.push_back(k + 1 == count ? length : length * k / (count - 1));
  return x;
}

std::vector<DiagramPoint> diagram_at(const std::vector<double>& x, double moment) {
  std::vector<DiagramPoint> d;
  for (double at : x) d.push_back({at, moment * at, moment});
  return d;
}

}  // namespace

TEST_CASE("members at the same positions share one set of Mcr integrals, with the numbers worked out afresh",
          "[analysis][en1993][ltb]") {
  DiagramIntegralsCache cache;
  const auto six = stations(6.0, 21), five = stations(5.0, 21);
  const auto first = cache.at(six), again = cache.at(six), other = cache.at(five);
  CHECK(first.get() == again.get());  // one set for both
  CHECK(first.get() != other.get());
  const DiagramIntegrals fresh = diagram_integrals(six);
  CHECK(first->x == fresh.x);
  CHECK(first->moment == fresh.moment);  // bit for bit: the same positions give the same numbers
  CHECK(first->load == fresh.load);
  CHECK(other->x == five);

  SECTION("a full cache still gives the right integrals, without keeping them") {
    DiagramIntegralsCache small(1);
    const auto kept = small.at(six);
    const auto extra = small.at(five), extra_again = small.at(five);
    CHECK(small.at(six).get() == kept.get());
    CHECK(extra->moment == diagram_integrals(five).moment);
    CHECK(extra.get() != extra_again.get());  // not kept: worked out each time
  }
  SECTION("a member keeps its set while its stations stay put, and takes the next from the cache") {
    MemberIntegrals member{&cache, nullptr};
    const DiagramIntegrals* used = &member.at(diagram_at(six, 1e3));
    CHECK(used == first.get());
    CHECK(&member.at(diagram_at(six, -4e3)) == used);
    CHECK(&member.at(diagram_at(five, 2e3)) == other.get());
    MemberIntegrals alone;  // no cache: its own
    CHECK(alone.at(diagram_at(six, 1e3)).moment == fresh.moment);
  }
  SECTION("several threads asking for the same positions get the same numbers") {
    DiagramIntegralsCache shared;
    std::vector<std::shared_ptr<const DiagramIntegrals>> got(4);
    std::vector<std::thread> threads;
    for (std::size_t t = 0; t < got.size(); ++t) threads.emplace_back([&, t] { got[t] = shared.at(six); });
    for (auto& t : threads) t.join();
    for (const auto& g : got) CHECK(g->moment == fresh.moment);
    CHECK(shared.at(six)->moment == fresh.moment);
  }
}
