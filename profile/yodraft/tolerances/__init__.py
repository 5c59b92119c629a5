"""Tolerances: ISO 286 limits and fits, bearing precision classes, bearing-seat stack-up.

Modules: :mod:`.iso286` (IT grades, fundamental deviations, fit codes),
:mod:`.bearings` (ISO 492 / ABEC classes), :mod:`.seat` (post and wall bore sizing,
worst case and RSS).
"""
