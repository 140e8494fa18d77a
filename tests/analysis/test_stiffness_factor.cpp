// The factorisation on more BLAS threads: the same solution as on one, and
// OpenBLAS' process-wide thread setting given back afterwards.

#include "frame_fixtures.hpp"
#include "stepframe/analysis/assembly.hpp"
#include "stepframe/analysis/blas_info.hpp"
#include "stepframe/analysis/stiffness_factor.hpp"

#include <catch2/catch.hpp>

using namespace stepframe::analysis;
using V = Eigen::Vector3d;

namespace {

// A cantilever along x in `parts` elements, fixed at node 0.
FrameModel cantilever(double length, std::size_t parts) {
  FrameModel model = test::single_member(V(0, 0, 0), V(length, 0, 0));
  model.nodes.clear();
  model.elements.clear();
  for (std::size_t i = 0; i <= parts; ++i)
    model.nodes.push_back(V(length * static_cast<double>(i) / static_cast<double>(parts), 0, 0));
  for (std::size_t i = 0; i < parts; ++i) model.elements.push_back(FrameElement{{i, i + 1}, 0, 0, 0});
  model.supports = {test::support(0, test::fixed_all)};
  return model;
}

}  // namespace

TEST_CASE("a factorisation widened to two BLAS threads solves as on one and gives the setting back",
          "[analysis][factorisation]") {
  const int original = blas_threads();
  set_blas_threads(1);
  const double L = 6.0, P = 10e3;
  const FrameModel model = cantilever(L, 50);
  const DofNumbering dofs = number_dofs(model);
  const Eigen::SparseMatrix<double> k = free_block(assemble_stiffness(model), dofs);
  Eigen::VectorXd f = Eigen::VectorXd::Zero(k.rows());
  const Eigen::Index tip = dofs.free_index[static_cast<std::size_t>(global_dof(model.nodes.size() - 1, uz))];
  f(tip) = -P;

  const StiffnessFactor narrow(k, dofs, model.nodes);
  const StiffnessFactor wide(k, dofs, model.nodes, 2, 0.0);  // widened whatever its size
  CHECK(blas_threads() == 1);
  const Eigen::VectorXd u1 = narrow.solve(f), u2 = wide.solve(f);
  CHECK((u2 - u1).norm() <= 1e-12 * u1.norm());
  // Tip deflection of a cantilever under an end load, P L^3 / (3 E I) (Euler-Bernoulli beam; e.g.
  // Gere & Timoshenko, Mechanics of Materials, table of cantilever deflections). The element's
  // cubic shape functions are exact for it.
  const double E = model.materials[0].E, I = model.sections[0].Iy;
  CHECK(u2(tip) == Approx(-P * L * L * L / (3 * E * I)).epsilon(1e-9));
  set_blas_threads(original);
}
