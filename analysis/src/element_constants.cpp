#include "stepframe/analysis/element_constants.hpp"

#include "stepframe/analysis/parallel.hpp"

#include <set>

namespace stepframe::analysis {

std::vector<ElementConstants> element_constants(const FrameModel& model, const std::vector<LoadResult>& results) {
  // The results' terms share their cases' loads: each case's loads are looked at once.
  std::set<const std::vector<LocalLoads>*> cases;
  for (const LoadResult& r : results)
    for (const LoadTerm& term : r.element_loads) cases.insert(term.loads.get());
  std::vector<bool> loaded(model.elements.size(), false);
  for (const std::vector<LocalLoads>* loads : cases)
    for (std::size_t e = 0; e < loaded.size(); ++e) loaded[e] = loaded[e] || !(*loads)[e].empty();
  std::vector<ElementConstants> constants(model.elements.size());
  parallel_for(constants.size(), [&](std::size_t e) {
    const FrameElement& element = model.elements[e];
    ElementConstants& c = constants[e];
    c.geometry = element_geometry(model, e);
    c.properties = element_properties(model.sections[element.section], model.materials[element.material],
                                      c.geometry.length, model.settings.shear_deformation);
    if (loaded[e]) c.flexibility = cantilever_flexibility(c.properties);
  });
  return constants;
}

}  // namespace stepframe::analysis
