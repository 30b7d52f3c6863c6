"""Pure engineering models on SI floats or numpy arrays.

One module per physical topic. No Flask and no pint in here: inputs and outputs are
plain numbers in SI units (Pa, K, m, W, kg/s, m^3/s, kg/m^3, kg/J). Gauge versus
absolute pressure is carried by the parameter name (``p_abs``, ``boost_gauge``).
"""
