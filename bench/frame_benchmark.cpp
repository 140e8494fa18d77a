// Static-solver benchmark: a regular 3D frame of about 100 000 members, a
// wide three-storey grid such as a large platform or rack structure (an
// invented grid; the sizes are round test values).
//
// Reports, each stage measured in a child process of its own so that peak
// memory (getrusage ru_maxrss) belongs to that stage alone:
//  1. stepframe: assembly, CHOLMOD factorisation, the multi-RHS solve of all
//     load cases, and the combinations by superposition;
//  2. the same reduced stiffness matrix factorised and solved by CHOLMOD's
//     own C interface (cholmod_analyze / cholmod_factorize / cholmod_solve);
//  3. the cost of extra combinations relative to one solve.
// Usage: stepframe_bench [bays_x bays_y storeys]   (default 105 105 3: 100 488 members)
// CHOLMOD uses the BLAS it was built with; set OPENBLAS_NUM_THREADS=1 on a shared machine.

#include "stepframe/analysis/assembly.hpp"
#include "stepframe/analysis/load_vector.hpp"
#include "stepframe/analysis/stiffness_factor.hpp"

#include <cholmod.h>
#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>

#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <functional>
#include <string>
#include <vector>

using namespace stepframe::analysis;
using Clock = std::chrono::steady_clock;

namespace {

double seconds_since(Clock::time_point t0) { return std::chrono::duration<double>(Clock::now() - t0).count(); }

double peak_rss_mb() {
  rusage usage{};
  getrusage(RUSAGE_SELF, &usage);
  return static_cast<double>(usage.ru_maxrss) / 1024.0;  // Linux: kilobytes
}

FrameModel building(int nx, int ny, int nz) {
  const double bay = 6.0, storey = 3.5;
  FrameModel m;
  auto node = [&](int i, int j, int k) { return static_cast<std::size_t>((k * (ny + 1) + j) * (nx + 1) + i); };
  for (int k = 0; k <= nz; ++k)
    for (int j = 0; j <= ny; ++j)
      for (int i = 0; i <= nx; ++i) m.nodes.emplace_back(bay * i, bay * j, storey * k);
  Section column, beam;
  column.designation = "BENCH-COLUMN";
  column.A = 1.5e-2, column.Iy = 2.5e-4, column.Iz = 9e-5, column.J = 3e-6, column.depth = 0.4, column.width = 0.3;
  beam.designation = "BENCH-BEAM";
  beam.A = 7e-3, beam.Iy = 1.6e-4, beam.Iz = 6e-6, beam.J = 3e-7, beam.depth = 0.45, beam.width = 0.19;
  m.sections = {column, beam};
  Material steel;
  steel.name = "bench steel", steel.E = 210e9, steel.G = 81e9, steel.fy = 355e6, steel.density = 7850;
  m.materials = {steel};
  for (int k = 0; k < nz; ++k)
    for (int j = 0; j <= ny; ++j)
      for (int i = 0; i <= nx; ++i) {
        m.elements.push_back(FrameElement{{node(i, j, k), node(i, j, k + 1)}, 0, 0, 0.0, {}});
        if (i < nx) m.elements.push_back(FrameElement{{node(i, j, k + 1), node(i + 1, j, k + 1)}, 1, 0, 0.0, {}});
        if (j < ny) m.elements.push_back(FrameElement{{node(i, j, k + 1), node(i, j + 1, k + 1)}, 1, 0, 0.0, {}});
      }
  for (int j = 0; j <= ny; ++j)
    for (int i = 0; i <= nx; ++i) {
      Support s;
      s.node = node(i, j, 0);
      s.fixed.fill(true);
      m.supports.push_back(s);
    }
  LoadCase dead{"G", true, {}, {}, {}, {}};
  LoadCase floor{"Q", false, {}, {}, {}, {}};
  LoadCase wind{"W", false, {}, {}, {}, {}};
  for (std::size_t e = 0; e < m.elements.size(); ++e)
    if (m.elements[e].section == 1) floor.element_loads.push_back({e, Eigen::Vector3d(0, 0, -15e3)});
  for (int k = 1; k <= nz; ++k)
    for (int j = 0; j <= ny; ++j) wind.node_loads.push_back({node(0, j, k), Eigen::Vector3d(8e3, 0, 0), Eigen::Vector3d::Zero()});
  m.cases = {dead, floor, wind};
  return m;
}

// Runs `work` in a child process; it prints its own report lines to stdout.
void in_child(const std::function<void()>& work) {
  std::fflush(stdout);
  const pid_t pid = fork();
  if (pid == 0) {
    work();
    std::fflush(stdout);
    _exit(0);
  }
  int status = 0;
  waitpid(pid, &status, 0);
}

}  // namespace

int main(int argc, char** argv) {
  const int nx = argc > 3 ? std::atoi(argv[1]) : 105, ny = argc > 3 ? std::atoi(argv[2]) : 105,
            nz = argc > 3 ? std::atoi(argv[3]) : 3;
  const FrameModel model = building(nx, ny, nz);
  std::printf("frame: %d x %d bays, %d storeys: %zu members, %zu nodes, %zu DOFs, %zu load cases\n", nx, ny, nz,
              model.elements.size(), model.nodes.size(), 6 * model.nodes.size(), model.cases.size());
  std::printf("model built, peak RSS so far %.0f MB (the children below start from this)\n\n", peak_rss_mb());

  in_child([&] {
    const auto t0 = Clock::now();
    const DofNumbering dofs = number_dofs(model);
    const Eigen::SparseMatrix<double> k_full = assemble_stiffness(model);
    const Eigen::SparseMatrix<double> k_free = free_block(k_full, dofs);
    Eigen::MatrixXd rhs(dofs.free_count(), static_cast<Eigen::Index>(model.cases.size()));
    for (std::size_t c = 0; c < model.cases.size(); ++c)
      rhs.col(static_cast<Eigen::Index>(c)) =
          free_part(load_vector(model, model.cases[c], element_local_loads(model, model.cases[c])), dofs);
    const double t_assembly = seconds_since(t0);
    const auto t1 = Clock::now();
    const StiffnessFactor factor(k_free, dofs, model.nodes);
    const double t_factor = seconds_since(t1);
    const auto t2 = Clock::now();
    const Eigen::MatrixXd u = factor.solve(rhs);
    const double t_solve_all = seconds_since(t2);
    const auto t3 = Clock::now();
    const Eigen::VectorXd u_one = factor.solve(Eigen::VectorXd(rhs.col(0)));
    const double t_solve_one = seconds_since(t3);
    // Ten combinations by superposition of the three case solutions.
    const auto t4 = Clock::now();
    std::vector<Eigen::VectorXd> combos;
    for (int c = 0; c < 10; ++c) combos.push_back(1.35 * u.col(0) + (0.1 * c) * u.col(1) + 1.5 * u.col(2));
    const double t_combos = seconds_since(t4);
    std::printf("stepframe (Eigen assembly + CHOLMOD supernodal through StiffnessFactor):\n");
    std::printf("  assembly (stiffness, reduction, 3 load vectors)  %8.3f s\n", t_assembly);
    std::printf("  factorisation                                    %8.3f s   (%.3g non-zeros in L)\n", t_factor,
                factor.factor_nonzeros());
    std::printf("  solve, 3 load cases in one pass                  %8.3f s\n", t_solve_all);
    std::printf("  solve, one load case                             %8.3f s\n", t_solve_one);
    std::printf("  10 combinations by superposition                 %8.4f s = %.2f%% of one solve (%.3f%% each)\n",
                t_combos, 100 * t_combos / t_solve_one, 10 * t_combos / t_solve_one);
    std::printf("  total assembly + factorisation + solve           %8.3f s, peak RSS %.0f MB\n",
                t_assembly + t_factor + t_solve_all, peak_rss_mb());
    std::printf("  check: |u| max %.4g m (one-case solve agrees to %.1e)\n\n", u.cwiseAbs().maxCoeff(),
                (u_one - u.col(0)).cwiseAbs().maxCoeff());
  });

  in_child([&] {
    // The same reduced matrix, handed straight to CHOLMOD's C interface.
    const DofNumbering dofs = number_dofs(model);
    Eigen::SparseMatrix<double> k_free = free_block(assemble_stiffness(model), dofs);
    Eigen::MatrixXd rhs(dofs.free_count(), static_cast<Eigen::Index>(model.cases.size()));
    for (std::size_t c = 0; c < model.cases.size(); ++c)
      rhs.col(static_cast<Eigen::Index>(c)) =
          free_part(load_vector(model, model.cases[c], element_local_loads(model, model.cases[c])), dofs);
    k_free.makeCompressed();
    const double rss_before = peak_rss_mb();
    cholmod_common common;
    cholmod_start(&common);
    common.supernodal = CHOLMOD_SUPERNODAL;
    cholmod_sparse a{};
    a.nrow = a.ncol = static_cast<std::size_t>(k_free.rows());
    a.nzmax = static_cast<std::size_t>(k_free.nonZeros());
    a.p = k_free.outerIndexPtr();
    a.i = k_free.innerIndexPtr();
    a.x = k_free.valuePtr();
    a.stype = -1;  // symmetric, lower triangle used
    a.itype = CHOLMOD_INT;
    a.xtype = CHOLMOD_REAL;
    a.dtype = CHOLMOD_DOUBLE;
    a.sorted = 1;
    a.packed = 1;
    cholmod_dense b{};
    b.nrow = static_cast<std::size_t>(rhs.rows());
    b.ncol = static_cast<std::size_t>(rhs.cols());
    b.nzmax = b.nrow * b.ncol;
    b.d = b.nrow;
    b.x = rhs.data();
    b.xtype = CHOLMOD_REAL;
    b.dtype = CHOLMOD_DOUBLE;
    const auto t0 = Clock::now();
    cholmod_factor* L = cholmod_analyze(&a, &common);
    cholmod_factorize(&a, L, &common);
    const double t_factor = seconds_since(t0);
    const auto t1 = Clock::now();
    cholmod_dense* x = cholmod_solve(CHOLMOD_A, L, &b, &common);
    const double t_solve = seconds_since(t1);
    std::printf("CHOLMOD alone (cholmod_analyze + cholmod_factorize + cholmod_solve, same matrix):\n");
    std::printf("  factorisation                                    %8.3f s   (status %d)\n", t_factor, common.status);
    std::printf("  solve, 3 load cases in one pass                  %8.3f s\n", t_solve);
    std::printf("  CHOLMOD's own peak allocation %.0f MB; process peak RSS %.0f MB (%.0f MB before it)\n",
                static_cast<double>(common.memory_usage) / 1048576.0, peak_rss_mb(), rss_before);
    cholmod_free_dense(&x, &common);
    cholmod_free_factor(&L, &common);
    cholmod_finish(&common);
  });
  return 0;
}
