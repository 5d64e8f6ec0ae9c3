"""Written by ``python -m tauscope.engine.distributions.exact_table_make`` (do not edit).

Quantiles of τ and Φ from 1,000,000 random walks per (length, lag) cell, seed 19790601; decoded
by :func:`tauscope.engine.distributions.exact_grid.decode`.  SE_TAU_1: batch-means standard
errors of the 1% quantile of τ (none, constant, trend).
"""

REPS = 1000000
CELLS = (
    (160, 0), (160, 1), (160, 2), (160, 3), (160, 4), (160, 5), (160, 6),
    (160, 8), (160, 10), (160, 12), (160, 14), (160, 16), (250, 0), (250, 1),
    (250, 2), (250, 3), (250, 4), (250, 5), (250, 6), (250, 8), (250, 10),
    (250, 12), (250, 14), (250, 16),
)
DATA = (
    "/Td6WFoAAATm1rRGAgAhARwAAAAQz1jM4EE/E3JdACcfW/hZBX7PBSY+bTvVvJJmKdf9UQRYkcO2xXPELPRZKqHnc3zwKwKm"
    "ivsbHxFojeBneSySZ6oYq1Ujt7MbbEnp4QF5p18oPNAtV0+JrHgAulvqsMglAzL1O5do6+4rU7yieeuoc0bLEV6OwPE7pGAn"
    "OCl0G/Zk5zBrMV9mvdgFJ5qf5Ryda3EWPpFvL5CbbS7wty5yvFOfqeXdw933StDCIpXGtZn2PNSbnw9Pol5MmIDjqcjNPuXk"
    "exHDR/s0dj2+HqoSQYPJabKwtW2JAxkz6VZBGJvSziiiN1e+eTxwh90PRR5e6Och6carrpA574YUm7eajVl7NFefPUaA9etN"
    "WegGkRli5+F85ptHjfXCIbJGSLFlZng42tNsYWili1BwqD5jamKLxSTPPbL7/etJ9KS3OnxTv43LWMlwQOJGznN/h1vbeZQB"
    "zSUsBbprVEFDnFfdG1AdySyJ5CchS5m6BL2x/NzhBF1V+zapBNlOfM4o9nYvMs58pqPXsuRlPXrScXCP22KWqPkAoKhhFd5R"
    "CsPe/7dgEeSM2sbBM+gYDOm5WdD+Lbhsb1Rduax1WQFWotrfQNgaDWh2+PVf6WjKQ0LYskgofMYMAbwL8iQRz9lgeWAqjWUn"
    "ouvamTVsnnG5mNfvwtkg3dBScGtD/OjbJBjm6eADt+AfofygWkqrPW8z2skg0JX37lKxDKsycWrkl3HYvLAFuQCGS5uHswah"
    "xd6iG+ooWnPt8+UIeV2eOVz4MpL0+OMJ1f2RmlOAn6bbehtbbRGlsHzjgZ/jOIRQ7XmHLDjd4xs2R1nQar95AW01sP3OUY/o"
    "XLu51eoy6UGEBVZ4H2EPTrrKpYMdDvyXEfLt9wgozWcwIU1YD8OIhtUx1QGhAlJPCVr+nOcftaEy0onkIivRFhESMTmHA4Aa"
    "/D0AcedLppB7fZGNsmT0SPSs6QvPSw0++IfsYSxPWYJfjHztxFxe0PTcgE98jXMPxN8tcKwx9VcA/RWoGVXE70LCBWCR849n"
    "Vkk4bEB4Am4ypY9wLVG0RnyfjNNLOT8oip/FF6i9OZU1qNQ9cFI3dRpGR4EngEhuoBdVHmHBPHtyMq4mo0syxLMMRrWzSjWb"
    "+fqIx3072J0Ir6V9rzgeqlyOkMQ+AN15zYCoPldrWHlvFcf/Yz9WC5wCx79D8KVZExzGRouxSHYdLintT62521SlTpyP1V2f"
    "eUuYySmTypxMBvzMn7r4svXFM72L3kFj40OmNjHSWRr/g92/Uhz5LP0rohmaJ/orx+k2e8qo43lAZAqGIT94DnCHbbWue5Ln"
    "1abRhliErLaMgtqXSX4yrBnukz7ldzY9l5IN6VABCylkgmvaxEQjFMz0/+Oz9lOSkauUGKeVq/EBS8SxGubNjmGQZh7nzeb8"
    "H5C84yM/yjR/TY+5Jr6Fyg1JWj+B2k/NoBNGhMwOszekzJpUL6/kHNWuQiMwcqP88gbyR5BWBvOEONfz8+urHRBivyJjXFm2"
    "qVAEz/zzKQg6BNac9Whwo+Fiu1I/miCKGu5Z8wyPv2W57QXzxgbT50TaoRPQyL5IACIoCBr+0fckv4+YoIolhd+47j8b4HXl"
    "v3yWomXt2RjiT58RQSrNnP1RYO3cqocm9uoor9IHfiUEomp/OQvG7gOmWjPKpdihOE/+0SxrekpfnrNfH2Lm7crltD6dqBxm"
    "wn/sdPRwJONxlE4wRZeqvBI0pVQNki93w9mixUZJN6YWDc+oleaKc5gsvte2A57ypCJB4YeqI6rhw25ARTJfUPTXJjexadqq"
    "vMhRobIbFsITNqM6pPsKIZqZvwig1rj4C4MI4iVQZpV403uYbme/32wc7bVzyF5DbtjbzW7B8EIuAVBwfhmMzys5Yq7V2npb"
    "m5UxX4sHe/PTRX1e8Lp+22WP3lQO2N2OustC8zCNrv+5+fdvbaKZTj2r24BJrzlGmqlgcLE+zoyrPgMH2Npt15zrU6SAIUIq"
    "dumc9TP+rrKZYm4gKOaL4dGHeMyiEyPu610Cl+z3ruKOVFe0UmuFueV+WGyMDndBNS96YuLneq3rw2JYicoaB4PV5MRXuh7O"
    "OLuVlLCu+vBgCld9HRE8wDEYGLY+6BifmAF2Sye1wy2LYY10uXYgZjw3FOmIUP6GelqdxwkLKBYSYKENQGPiT98sdPoV8HMi"
    "IVeqWEDbvc6gkF32RJRXYJCHZHl7pJK2n4ES9OKgIO46I9nGNGWZwDVO383FTHMORncCTv5tUGfsGHxMKj0IrwpKhOCbPyIC"
    "ILlhTMxt0B83+GfMmEy9mfyAIHbn5Qj/e85jL3PMfnMRdi4fjMHpmQcDb6POQJAyGM9e7sc1XjKPLy5LjNAJhCZ8LJ/IJT6O"
    "gdXbGFA7DKPJArAVr3hZYXOqwkTYQMZoztrCSGNMCdyn7ViQ08Q2YFtlXQSeDdDyfAvVP9+neWcXFjjVgEb1MOHh1g0lm2/w"
    "LPEvuSWmTCRrWYbzMIHxBUrtd5t4hNuG0cIjxe0L7hbMCa/toCN1hot2jxphGDyjU/wcBpVjOIChwO7B7JyIu9cXRPbu2tHX"
    "RfoMfb4tkNhxNArVUJlzduIr7rhWcRXtHoLxBCUVOQHUWxUSpPDKQIFPiZgbxEKGXjY+z7deNJKLlf98Y7V8U6bHO68DKQQY"
    "XoigrkFXdjmwdHcodIqWVuTC4/yLuVHltwpTORUm4AWMdwxdp5eAjLLX2hQZJeVwPDpkQAqafQp+kH5ScLohF1UNUYjHK3td"
    "J0pa7B6Wxpt8iJBQivonoHj2D1Y+SpuBT+V31W5dlAou+2Yimv+L2xqcz+96dueQQ8qu/b/cigom+81EK5o6s8Y5Dzx2jJ6q"
    "rJ125xeYbrScCshRyajzUcwgcggT/FfFst2oFqfdbDho+Eu/aPA4SSYVSnU6YPKdL3tDyvz3F6NS6VFXChIbjKsvaA9kSY5O"
    "IcmiKnLge94knE7d3gMMg+7bCtzR3TSCZSLJfsxq5fWR9v0cjLZceTTpcoFBmqQ1GfRYaCgmnJHeOB2ncJVlYb2vtlfBIPzo"
    "ME9z3AS16jlMSVLop+FzukrlUY7icPU3Dm5O66iL9/pO6IzlQWeGCCQdSk7JkLNfbQO0KKqkh10Iob4TP4A1Ao3bEg2EWgcb"
    "R+WsaCgQPC5v4e6ZgbFnHHjUUq0ELRvxVNrZuF5Be5Zyx5+KkC9YE5w2/HlvmVAQSZd/CpFQOQi/95o2amUaQTewXSo4REhO"
    "t7Hm0mO1K+dRrCiDalFTiPiWdCMboA1ie2BbK9ZcOOVO3tPeIn3uChaFqxuUpna+6FVIxmhPnsG1kPxD0yQAcutXPSqlGiol"
    "WIqHFQALsskXb6c7Gq5b95mesptQ+MMUkoXOUDWn6P0rUi1qNkVpkHhS/r1Eyg+zsYfBwOR2/lSuMX4urvXjOEIewfSXMCqW"
    "yAZiHT3pSNP8CnHzEOjg+7nrqVvQVq5x/tFttCRbnEWGKm1D9VetM5eqlbltqpZKCy1qSV8hrgungAyktWRsdFGgkrnVg2Fl"
    "iq/3tR0+tetz3WNEUDn2h5w3iKYk/DEoMf5ONQjqzcywNtdweTz9nPXvh1LLekxOaITc3kygIHSvZ3026YcUSzE5BiynLZ+F"
    "aOifS+/RiE/omhOCwE35jLqGzLKyhCJGK/ohcLRlNq18FRERVz0ykFcJJzVhBw2glgIjn0OcdTuDNkmBsBwkULPExVpl30Ik"
    "Rjqi42UA4BUM76s8opmoEvXb5obZYsqs9O+Z3L2/3/xw+uxjMAS9PfaBbtvFPBxZzrzr5b1mDR6VFjOTYL7a8SyQJ0NT0ECo"
    "OckKAbUzO5if5C4z0XtagKI6VxbVqEVWKs5T5RojAmU6pBm209vYqg0hrqvzNHeYcGc2bZw/5acZMzYWc8tt+ofH4raPcYmQ"
    "Y2kTnW5gxGG6xuU/I10Kb05s9x7KfMV/7hsRp93K1wtVdfIqbsM8c2wpkqpG48BR0xTPN9IJn9QyLWfdftCvXmkFsNn8Ecx1"
    "qy9TM3Y8fwnzynGoZE8JwfK1muKOdiQw3SAk3zLxexoUrzSuMv8QsPsJMquZ7q4D7crZH8JRdOT093h3jBP6Nb+WfpGR4rLX"
    "aIyaRMIQuWjAQChU1e4AvS0HZk2y7oAaRWbQWaUUZuW3KzCDd+vxemKl0nxApLWnBfDUYuAiER6xfI9Ysn0N/d5ckqtYHOX0"
    "SnqMbdsRbypKfAOh+Ao4eIglmomNW8E6A5lmLvORak5NrjeTAIKIz/IqfnlBgj01WHh/CxF2KO155ymzHpf09PDFQkBjqNGe"
    "Stwa9BvIPo5pqSaZd5joe04Gg1hK4ZML2g5IoQpAhdlRCmBy7sDvm+0zCmzjEd0YbuWjMW5yeo2fizOuaE1bYrXrINSusXba"
    "WEVGuMAIGPyzxLXb54yYf4v22hLo1gNzYttFFqFpxU7fzMJ81j5xOsyD0n3Xr03Zm5yKwzc3e80iBjPyCQaRwZcs5J2ZRoR6"
    "XdWn5zBfUk0ukZMJvn45h9Xoq6KdOSmWYL58D5N4mVAJS0r0dGkzD8ysV/0rGUopddz8+eZlQlM/0fbPJ0GKqi7pLuinEVRe"
    "yP/p3BtEHthnjP86H/PFq67GMcIIbzT8x8XZeYA+G3+6sV7481uRaQVYhYUflFAzmLg/K2fK3hw3z45QzjbCEqf3rgvQprCY"
    "ZAkkWEcJ0lL7kGIF1C6XhYwL4vppjA8bHE2pOSCG/TBKwtpBWNKziqhpvaX8VXE8nuTa3ppjLVJUbk9MIuWhXgD3CeyW0dci"
    "7yFQL2yYpPtxpQgiJo7lb5dtT2rcL8q6+XYNAtBvpvoTT14IFfrzsAql2GHcZ8WxYo7SklsdmiRYVIa632zfTiJiVDSosve3"
    "tjgOVGuWTuPFw2H+PRAG2Mj8+JC+mX6wtzThu4uYjzBDXHLvTHT/Bb/zLyUGYrq+zwajnn7ZoUF7rED7ZaEn8di+qtISqLjB"
    "qfQO876X1DR0lH2c9u/nS0ZAXby8DMiMehC8TD4jbRCOk/m//CyDGu+ytvnpzjzmqxC6HlqgkNwPq6utlyzL0DZV2xh3Uskc"
    "S+qgao4RgbSOpcBEpdn8dDhYSaV+n/A+duhWWUq4pLTHU6ho3mdXYZYypM/qsVHm0S1uydi8l1NRYhYK8+jdEcXfhLNZNvsS"
    "BBC5cXQUHp44NB70YlpWXX9uJ4Bbrk6L9AtU2hD8lBGN0IBIt9JF2hNJcdLYEVTM4kJeZIWuUBvvGNrfGLM6nUystha6UTid"
    "zvzBiWt0e+NSfOOCq4tVNqN/ooxxvKrExEieE9WE0LxLgTGHU5kPbSPSsDKill/90dy+ODvoeBFR8GvZ28qarQLfFWT8m4yD"
    "s3ItK5dW5B8fy5asj/p5AmLi6seh/C0erpJOJP/9IdigNHbbAvFwT3P4vTnEK7fEti7vh5+t9PfKLqcKXIHpq+P/MFO7d0S8"
    "r34CY2NxSlDinpKT0fbZWSTU1xUEBOHmFq6uDjjlnOTDgxNxd2HBr6b/iQo8Kgg6ZtN3hy9awb4Wwlq40YnAgsw80hqBG4ej"
    "pEgeEKiNyMUQHPA1/zSzzaqpHsj6oVX/zXXl/WP/rrUIaBvJmGPgRHpvm4eqjWMYRcnX5EtPwf89MVgto9s2vTf5b+IXI9Gj"
    "yhzvqK+a/R7ULoCuJRpqphK2Mjibo8My1jx3/XNHupRvP9enMC6xPDjIrzhlvITXeBGT+SGY1id7iWiHLJT47oGRjKNSVmyf"
    "Vvf0tXVaF7Yy2bm872Z/vnI809O6kACJRDfq63KOpvQYBVHNXEZ8QglFNhYplkJizYB4MVdIgMVuvh+1Msilinry0rLtSfIy"
    "1FXGD+CdblaPHp3ThHhTs2S/xzB6ptNo4Fv1yYep4+bofpmPy3yQwaxR7UNPuVq6Abw27E1fn4muMCzzOh4f004JLZBTvSN4"
    "KHPOlWP51n3zYeu7I9SSLfZT8YcjQCC2I9jb+gFALX55Al0NM1Qiag4XB5F1cgt9Csj9vMVWW9+9HBNVehBStcOLU784ukaX"
    "Cf2ScR4NvuTCRnKvxhVCCjInpdLh+fw7lG2r4WEaQd8+lYsk1+XQpPFEeTlU6GcGXLmkEcKQspl0UvO44OqkG8IJqFDS06ef"
    "3YTClW7PVGr8Mr3tnfgIbc9VuyhwfJB9Fd86AxKBUxxIYZLI5ku08T2LoszdVf4OujCDvKNIFUI6+eBjg6Lvbrya1ahmneNh"
    "+++5ftsCuwxlDpvS4W3wEHCLGApBGbJKSzPhqk80FSN1AH0Hdx9Mtl2d8GDVF7FksFP8UzD+jPBodF+M967cOLtWVYt2aQfl"
    "XIMBU+RHCcNxCSbSw2IXXQZuzch+hGcVxmnHPe8NI0kvw5mprgjioTYp8MRmUQ/L64V+TtWnZhJn6QUBo0eund8JbygOl6QD"
    "aK8fD9TCXh80BE8Vt0DoPW1sDpIBVag1huRqXhiu3K45BHdz2yCvHuL1zi/Fv0cEj6nJGCyjhRAFo2gPH49CbK32nyOfUGot"
    "kFkhdc2Ry8i2QdjYy/SlVfvodQ9C6FcBdU04WHw6CGjtQiJvGa46ZZsnBpfM9e4jU+7jdhvdFvYkEzn1t0WBBdjOsLbmIwef"
    "SLvt4/1VS+P5Kq98/fjMbt4LPXu/7qGi5fPQou1Ac3FIGMEEBEF4IVoAAAC0n5YwtTHnrAABjifAggEAyELpGbHEZ/sCAAAA"
    "AARZWg=="
)
SE_TAU_1 = {
    (160, 0): (0.0036, 0.0029, 0.0044), (160, 1): (0.0048, 0.0028, 0.0039), (160, 2): (0.0053, 0.0021, 0.0039),
    (160, 3): (0.0042, 0.0026, 0.0030), (160, 4): (0.0052, 0.0045, 0.0028), (160, 5): (0.0053, 0.0034, 0.0035),
    (160, 6): (0.0039, 0.0035, 0.0030), (160, 8): (0.0045, 0.0039, 0.0034), (160, 10): (0.0044, 0.0028, 0.0036),
    (160, 12): (0.0029, 0.0038, 0.0025), (160, 14): (0.0034, 0.0024, 0.0043), (160, 16): (0.0037, 0.0046, 0.0041),
    (250, 0): (0.0041, 0.0038, 0.0029), (250, 1): (0.0046, 0.0038, 0.0030), (250, 2): (0.0045, 0.0027, 0.0024),
    (250, 3): (0.0031, 0.0033, 0.0023), (250, 4): (0.0029, 0.0026, 0.0030), (250, 5): (0.0034, 0.0040, 0.0030),
    (250, 6): (0.0035, 0.0035, 0.0017), (250, 8): (0.0043, 0.0044, 0.0038), (250, 10): (0.0035, 0.0031, 0.0030),
    (250, 12): (0.0037, 0.0035, 0.0042), (250, 14): (0.0047, 0.0032, 0.0017), (250, 16): (0.0037, 0.0045, 0.0022),
}
