// Environments, MEG, ECC, the diversity study, exact two-branch combining and the fading simulation.
#include "python/py_common.hpp"

namespace ellipsa::python {

void bind_diversity(py::module_&) {}

}  // namespace ellipsa::python
