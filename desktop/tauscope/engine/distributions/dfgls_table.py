"""Written by ``python -m tauscope.engine.distributions.dfgls_table_make`` (do not edit).

Quantiles of the DF-GLS t ratio (constant, trend) from 1,000,000 random walks per (length, lag)
cell, seed 19790601; decoded by :func:`tauscope.engine.distributions.exact_grid.decode`.  SE_1:
batch-means standard errors of the 1% quantile (constant, trend).
"""

REPS = 1000000
CELLS = (
    (25, 0), (25, 1), (25, 2), (25, 3), (25, 4), (25, 5), (25, 6), (25, 7),
    (25, 8), (25, 9), (35, 0), (35, 1), (35, 2), (35, 3), (35, 4), (35, 5),
    (35, 6), (35, 7), (35, 8), (35, 9), (35, 10), (50, 0), (50, 1), (50, 2),
    (50, 3), (50, 4), (50, 5), (50, 6), (50, 7), (50, 8), (50, 9), (50, 10),
    (50, 11), (75, 0), (75, 1), (75, 2), (75, 3), (75, 4), (75, 5), (75, 6),
    (75, 7), (75, 8), (75, 9), (75, 10), (75, 11), (75, 12), (110, 0), (110, 1),
    (110, 2), (110, 3), (110, 4), (110, 5), (110, 6), (110, 7), (110, 8), (110, 9),
    (110, 10), (110, 11), (110, 12), (110, 13), (160, 0), (160, 1), (160, 2), (160, 3),
    (160, 4), (160, 5), (160, 6), (160, 7), (160, 8), (160, 9), (160, 10), (160, 11),
    (160, 12), (160, 13), (160, 14), (160, 15), (250, 0), (250, 1), (250, 2), (250, 3),
    (250, 4), (250, 5), (250, 6), (250, 7), (250, 8), (250, 9), (250, 10), (250, 11),
    (250, 12), (250, 13), (250, 14), (250, 15),
)
DATA = (
    "/Td6WFoAAATm1rRGAgAhARwAAAAQz1jM4FNfGeFdAEyYW/iYBn6OoFjwSozIgR9H/MY00OZeibRrzPfBFqQqyaBsqMh9YDx/"
    "GVYFp/o2pO6GHs9X4BYfMaTEzsHs42CHHRCpOddKSpuayI4Tx4Ubaw7xE6G+ScfmwVhIcFRd/R3zq6gF5BgBmgR0vd3qYaS9"
    "mpo/McA9jzOWVpXQqZeF1HPs+SUdyAs5tLXJY4OPJw3NPvAuPxrN+SZl1ziCOK9T4F/ckvD3fuSuJaGIs7X/F/QV4zkxm7mL"
    "Rm/ZiAeamBakj9jk6BQaSsymQ8ILnAgAnFcLL/Lja+isU6E6KG7/K5SIVVFx4h8YzHhR5QKD2KOykS63ERaBuOJC7tYTjJQ2"
    "6JKmrsuvCu5Tfl/DvJ2JwLKPqRusvro1nUO6XU3ZJbMruAgHtK6tTR6JeZG4/JWnmO9w/CQU0V4nEjWnP84+30qIlp0mHVqn"
    "k6Zo7B+3KQFL4BWUbU5k9fF/Rc2ggHUW86iL1/jnk7NqCEHsmeGvxTr4xMbS7VrMDVKkcn3ByblPbAU/KZv8zwinw4uEduPn"
    "h0lQyRTBv2KuHEOvrqO3JdHNvDT/C8qaSkWciqAQl7rDqNkcWiyrh+0RbmbUW9qvQmhbTJs3GPhffpebFoqj0vsP5RVWPloD"
    "nulM1jeZPOpd4xNZq8G8ck09KVlZgXVuEkZSA3lszcs8SDmKcveKmXdSAiYA5UVwp2zeFIZQ7I4IUlkYJKLHhvAyQ23Aok7m"
    "0gZA9oo08Y4EOdbRqeabVe6aEAQRUaF+bqRloiiaHUXpziBvi0v5xX34R0zexIuElki61nk8eupPTrbGNAy4GP1r3edxZQy6"
    "4J/LkGqoXSV5n88B8AI9T/84KpSKAsNvATRLm2BZa7jRUeVH09St/teaTyQ9hAV7ejq27Emesrat+IHZjzS21zt9gvo0n+Hz"
    "46gnHaoZyShHKWbjYuJ0hDcszvQrcakJThDJ+g4Gp2Z9Bzw9Wbk+HE9G/Y1s329YKJDdhpZngKhZpQUOuIzuyT/xAL4Yvr7N"
    "Qt21O5v95PjZBKHkvNyPt1lkAR5Qj3d3fx46i4PpMRSal1YpUXJPdfVPjYxDAo6hv1+ZlX3CCb4fh44sYORgwtuug70VzVS4"
    "EuCGgI9rkQ7EFuZ76GoNAtoLWmsOBVEtdFzUFMBoWpAGsVJiDyfHKociSqWH/bzGL5heWCYW/oUiFwtsQadHZLrNJ3oZSNA/"
    "0dymfdrkrCdnWtPVEb/lVBJiYE4bpwrc+fX9bQc0eCi5S9X8vQKGu7X3oUur53KI+m/mUrQaXDpxQ1ureE8mYCI1EqWsxmlb"
    "5CvBFtelDOqwZjUX3MyYE6Ov5SURz/ILsdAY5BI1cwO4+5jidINSr6Gi1jvIojq7ONvOdJs7pz3if3IWLDJRRnBzkaJcjfew"
    "zHJAFI2j4/DktZxrnr24XN0anh53RdwEBmXDNUwMqYRsvmh6J/IxGTHqyAhFuaba83M9n0PNe2SwfRAfeQrvOK1jvIrwQuAM"
    "iFoZo3g+XkfuU80rfW/CgH/XF3wvraBROXLHZJBvJRDftsEPSuJV49NyMkUTqQw8jvGu1CjjSrjnBchAi6Z4FSYgAWPv54XD"
    "bKgbSAOkLYI5R9R+xOnmwpK6lTzPuTqQLdrHwAQZuDwaxcIzDdo+v4K8Cny1oVB96VzJKznbVbSBIj8jqhBj3c+HsGgZLd5S"
    "tg0P0aApv5wNwl/GwVIGkzzOrlZAaEjNQTckkuFA+kfg/8gpTZ1FpReWb2rLs+dw9pIwxaz44wc1nzznZ/UtkUbWGhzVoJzQ"
    "sBno/MOY9UHmOyC94h3SZZljSKNsYdUu1k0jNUcM2Ltuo7Ato2zDBToOy+rUJRnPpHWBEJmMWAjGURa+UZUGznn3OcUvN3E2"
    "NhDLSwSqITkUj5qydEBbug3S2ZjBht7VHIhzCQuNkmDH76j+73R19cCp8eDLpVfmoEXJEJWcDPo6Wt0WRFV2GFZc3kAi60Bx"
    "yxcgXnGokoooQtV9z1MCH3xvIf71mcY2Ugdgq36q1FZYXJwSFBlIDvCmN98+YDqIXsANdffglWgRHPfRm5CKe9ylrcM01Gyq"
    "Q91fL/YHpKacpzZG8vVeLBtEziIHXoGa4usx8LHSanzOKiyu8tyQouGaQaDeIVGI8jZt60d98aeE+2ci3cpNQpoxQunchpzc"
    "jAymrAQSiUO5I+LKZO3CvmAyAdxwWqzHUf1vaAVIPigbr2wb+pXUC9aZN1kF1005foq3kCpxiGwmDdku5bUkhhjFc8Rbz4Bq"
    "imPHNXK4oziIZc4mZx0saMH9MgSS13w6frtkZTp54xmey3DVpviuM2x2CZt2i/VbkA169JITCrSjl2FyzntykrZb5Gdonx8H"
    "B178/FT1rt3t6ECTA5UPo2gbZFY5HU1hTUIeVpsxbsnuIUtsDyiY4rrgHfk/9xcyJYCaEExkj2WD9gaE61pPbfs+n9McV7j1"
    "7gqPPITNB3vlwZw5NT2p3hdp8gHTHvEsSxXhSH3WXIBndNX06AQ58Ueyd8pDhZ8Zb/F56u65dGwwMOF7ciJiiRLFyoOdrfun"
    "nf+DfNGcr/VxmIWvliikqSZqY5mW2q3dDp/VQvJm8vZ+BrgbmeIskXBI6s3Xf53RqzncEQuDwBplYXOrflyDsEj8WgXNaDK0"
    "C+LH3TS934gypCzZsOak38FGjLzeCQowCcySCVBS+BUpUvKM8sfd32VQY2U7IU4PB77Irq57vwuO4pFeCOewyuW1/Js+FEOy"
    "3nf2EiRG1DyP40qKYmx7MujYd+BieV1jaxM+adNnlxoViLScPpm3pJT120dLKOjNazxVGd4VRnlVZFebvQltLuPC72qJTDwJ"
    "kqgGEZ8eqGEa3KToH4sMEeWZi6iXozHH1GQNDHn8u67Gjxwqbk+9+WcFV/JPawgZ7HNDeGyhL7FXPr64M7HLaZm8giXTGX0w"
    "wiZBEpkFFRRNlIw1xweg5qLLQ3HC9LLmAd9KL3Q0jCXKPt9sqlM43dC4Ub7Ji7l2THCvo5jWcL2NphEIW6+WoFVKWilOXT2V"
    "7CIYi5yKsRbEjO9zkcyqh7zFIb+bnF/dijeb6yt6xKnLV6i001uOsekWN24fXIwQy7SwOmiQXyVBS0JRdQYMsqcZmitP96hm"
    "OUTjequy7hgG2Z3vbOjR2vE7chAh3CxWIM04jgsGknVFXF11AntvJqSFXEy3Qef6FjMTscfOpkCnkld9pYSvJP6czvnJHOVn"
    "1JoSBnoOxT173wwbZPYc2y1Hrky/Jtr94gibBlcdi3hw85ygyyjQGOCNJ0lI7F7VNsyc7i0TKiQT6adzX7RxPeRX91aJXgfd"
    "mtRTkTi10utSuD6R/fK1A+r61jnELeV71GX9B7Zc3KXqVeEg2fX4H9BolBI/PbI7J0UGA16tiKPtVKnlHPclV3BwjD2W07Ag"
    "EAE9rqCRuozuoDjfLUD8rjuSzjnWGJc0qPPPmnhbh22/4EkU4+BGsOp8AU+9kbuZWOSvxmRKkyCXijpf0Fj1X3quZm/KvrDk"
    "JUOrq8NMHScmIne/w/apugJ6QerROALoZkxxxrgSXxz7NGocj+SAII5yIlfRqbnZT2x258rNeYrQSKkhbHJlJDSUZQFeXdWX"
    "e40P98U2spJuENy/BPho8bCLHRtLyFHKQfjt8BZ2nBSkkiyaz9c2mgRejF9kRHTroqXWCnituhIwq1KMtO5I+3XO/HiQIqOw"
    "+vs9jK0efbYvlQSiW3b869KsyAEptt844ZRA7AWBrVXrv4ELXlTZpvmfusQ0RKqyFnX4oYkxI33AkDzxea5AfCeaZXb3nvqa"
    "x4l7Kz3wxHA3ShoGFsrzhr/9UNQLzPiwOm+qNByhoJwOLb37iyGKk3aUwX7ff25/DZSGU65xqDR7N9vx8XraxmWGJXWN9Gfy"
    "/VmeEh67a2rwzyINue8ji4+huoX51kPMVbQQlWocmzsa8fPUamb3EyLIDkWUmy4LZNQnWtN7S0AvM3LQ925x97EEQhEXCpnV"
    "aenJlt4LY1a2jdlsWP2oYQvf4J70W+klUPNDvR2cIfqLXgAeLtmdR2nc8eUoZOD9B64stJBytvpHQ4093UyDRw9EcwmiaDFN"
    "uQTUjjiUu6LoV1/nFc/P/uLYMYg0TGkXLCQD9d3P/cHfW/067bO2TZJUEkG4W3Pju3yxf3AvZ7UnNz7hdDUR5pEy2VZUIKFm"
    "qPRJQrtI6XXjkckHejdcJuIMpmN5u5UKDM7cwPl+r6ijSQau8fldBaQF15qFDQX75MfGdwbZVrq2FB7uPBtdhx0skKukiK8S"
    "eV6X5wCsg2cYV6FCN59XKiH6qYtti+sU2AvhyXcmrOvVBHOtoMiIH35VnZhIvRfhbJ5MsWeY+9viipT3xC4wpxPWrDv599D9"
    "GWipoYlqrO9N/XYeBZig6IYRq8BwgFz4UVG/Yk+F9VehkXshNDppLgJ5O0st7NBteAJh1k475eVjIDtkE3w0+2J2PudqqZQ1"
    "Td2qa5OtFjGc1gS4S0IrP/fPwbU9JnPhrskKxYd2Iq0C//ZtpIOSCca1B1BjTc/v0u2X/DFhUsCPoHv/a9QOXa6EXEH7E0Bf"
    "kl1A7ft6uXPEk3Belcj1jonVN7mLLtbqZ7LLk1ESWZHTBmuo+xuQw+r2bhhKPgTbZUEU9uc68SfsJMMX70GjahoSCdkCTtC6"
    "0nTvqATjPTI7RiYL84jRxLwxezGgVps09ekFdOJx29cO67saXENw9XzKnauee5C2YQwB0TZ1vwd35IJteqoxjeD/pGbHWtjz"
    "4bKuR9sL+155HDmRelqCkgRJ5evYGt2j942yitfg2fhY5A0kCr5TqkinskmSv3RcslN0L2l8azVQZQ80c3A05+qgUzoaMYLx"
    "WMlYiJaWr6POGCoBC1hIxLi+fMFFMDORC0YYyYs8SPitD2wIZTqjBNnd+hn3eSxnhZQkQMkzIjM5scinfHQg92cJcUsyQTkb"
    "p8W7I3dRvnZRi1wKaziEVYWAV7627L/IerYKv/SAe6jwY14wTYHY9pabYCfRHh1OBkjAa3TfFAFmxMzv2sObj5aUhtBP78U+"
    "It/8DGWENkAAOPDxNm4YY6L0l6VeGwszo5NcyIJlv2IcRMW849mJVAW8LF/MZi8yJdAQwdw/IXBgCNAUBjMO5jtGrf/c35v1"
    "A7UaNpFbKyxCGJcan3zo/hHoTVx5mcrcxNHH0TxsL+jK/9oDU6tFj40nesJsk6/1yQ6g00epriOJ0lK0oxSzY1/ZcoHcT8yu"
    "0ayCIzJ2Z+Y+yHoB3NBvCKHbW3wJ8Mom7pIYwqd7oqMm64aDFr3KKCriUWniPTGnkEyjxUpbQQJPO1v4za87YY1vMvuDGH5Y"
    "pJaVHm5cBcJCcNP0Y/Nsdk9byKQbghMG3bes09+AJXtKE795K/0N0T5oshGpl+4kpfhgz5GpzCPTanAfyZHgzqBzd19d/xDH"
    "uWtfgio+q4nhUzh+KoUP1X5jHm5etKTT3n59X/gAwWQ4n+TdscN7eyEVAeDux1mr4yaqo7V+0iGkabp7gkQ2Aad7tab/UUwZ"
    "lFu9EmZIDVqM8OpYtL8jrFbj2XtfDubA38Vfqbmzr9/TFi6orSOUBdrE37GcM/7gw9rjqNoNItSzgGP1nJ/grFxNFtD/nOrj"
    "GAQdcC0Qy/7JOVJTnDqweqQfF1NxsmRUcedUyOb34PoYBgvnXC7dq/iSAzR0djCv1gRrB4owE+Cj3KWfmgmS2sVF0u8DhUTN"
    "35UfLp+dyVuNnP7cKIwJu54dv2CTGT1fufIaBSmqxlbCIDiQi/T+2PPNf5zoh8c3PbsbAxpcxRZ6mIVpFJqCZ4+F66NMsOB/"
    "nSxGPifC7jJfBKdEV0X6ZRowFAH2pHgJtbTucJrQMRXHLq01Z+Q7udHxWSZfl3ePpc563gWMUd2EP5Np0+oBbQQOLNx7XAwW"
    "cvHMYHVpo20VuLOaz3DSrCrVDLh1hh2EJ/5nl8B1/UUvWQmnPE3XDDubbYXO/syOLAwdFAfFd8yhI2jjcnTPE2VCdS23Fi1T"
    "XiAcJbRG/jSU7mASO1yvqncuMgw8aNLg6u6NGEgqflj8cYS8xfi0uRyhrMlJO8UJfBKCRzGMJc8KvYkTNHxfmyn1wQzbq6bT"
    "h9DfbTuEN1f6zWEC8hSQc+KCbkqB3iOs27aI4jSZ9m2r4RdShp+UaWasbiEq7lvcdp/BXFHjRr5QA6+9mSzr/m1Z6LqkzIx7"
    "sCx0OTgdsQ7SOU9I7dqDuFvYke5XOxkYqTCQErIKN405+l5Pl4dTIEPQf7gBYZ9FIZ/K4Jyw3OAwSeLPbTH7kZiPCPVDDTJG"
    "l0RXbU6tHXSk6eH0hwNbb12RnDUbFx97HLfaWlhz/oPj44izOtYMcrPcA4ckPgYYTJr4/6XcrVA1Tt1UGS263kPOZEB+rx4D"
    "Q6KvOXLsXLLqLmZxf/4gYyVDnS0USsPMnbTp/ufcUYdc3fAUQHZEE+hLz1KMYjTEB1q4lb6rimDB8KM9O3EMi3DDdP3iW56e"
    "tgvTQQFIBcC0ZHVTH0alf2Yu4GNLR9/xrsZG12yoPy+E9XhUi1bY6JzK95pGlQU/HoM/jn8SwnIW47KoJrrzAhHhnKMAJQGY"
    "+OWat4ahPYJIITuBiUw6fagLlG3nPILynwjnFaNZDDHd5nOjaC0cXmtWmGTnKRpzhhr8G1B4gpesP3NbafZZnBA54uaQaL9V"
    "Vlygo7pDEZdHP7Naoxk+33pK6kkh1DFn275FXfsSvWvq8EfrBi6bRap5y915igh2Gu6IRWfoBcBn8KdkurGlkBSBTw5k4W4r"
    "LU+Tr0NfsxxcvA1lw1mZn8jGtpvx885EPScWqWrJQmMcU3xjm4K6Lm9ZzFVJLNUImHHQNg3JzyNb+0b9lFwqUowVRF6+a83g"
    "WQw5r6uyAQjUn4io4GX9pqbmxcIYjxdH0ZKtC8SvrcS7UEJ90jaKUOl2+a9JRPBPSFDSJv6KQtgTkt8l8MKNK6kvlk668Fn7"
    "ZCXhEFE7gFPVH4l+FsrUOf1t2AFrE2f7m7qOkhCbjlBaHRZLcXbt2nzjChRSlSSmsGUWvUqy0AaH21lxqeYwyTtw/W7U+W1g"
    "4FkzT7LrW+BcYzagkhh1QvQVRFNOJRwXNX68WY+1dsgVIci/1+2C05l/DEbqJP2u1YZM6zjAVyP8ixyfJPbyLBTWOItkOhcr"
    "puXGk8foPl7UTfEOjp/vACN4qpXoCW4LxYDfLFbmG5UO2AyhA2HrPRkgIr6zgQP4te/869fqu6cfeI+902dak0RaNW9Db8mK"
    "tyuTGkdiMn08NafRXpi1PSrCnoxi+llblnU+nhUkvn38x4Da3c3WnQwT4RlurKXY+XEAN5L1SYJ/MlR2KCswefc8XW+QYTL0"
    "4+iFGCLIjojtprUHiVcMy8p8/LhKvMlmT+U2C3aj9B+YJmTkBGx9aHBrtGPYmuW/MZsWLhQt2bcQdh/ifeDDbI+2zJdCnow7"
    "F0ifsDoDJmGNxk+uG0cj4bfGSJhBu+kzUZhrSp0mRJ8iT5Z8rwR71/WVfGRwGTnmLHTu47LTpCBMYju9OM6m6RUXG6L+Uqeq"
    "kCk1nykY7G//BqwJwM+m11RBzSS7hx/xlYB/Sp3mH5ZkSonI435YtWilZTkHMlPdFAD/7CkJzT2Yznc2JLivQkYQ18zuOR09"
    "e6KzizxJy9gUlY8U/qmP2/Eiojo7kO/pxGF8bPaAT4oGMQicS6B4/DLHDMtD5R2hp25RbOpo3B8Mo8ecBliE3sc1l/oX9r6S"
    "y4uUPDz2WyMjprJbzukDFdRm5QMBWBEyTXWT0zIZUzxE5atY7PMzT4STGRnbOcV0fJfK3rJo2128e4F8veWdv9eZPsYy7/4x"
    "+G10HKjzmKII6XShGIgA5jw8AtxO0eVMrWs6BYJbw2nmQdeRvKJZk29IgNaoferPVu+KZbBcabdOsJEE9SJ8fK2qFcRvJ1cv"
    "n1VqdZ9jnaXFNL2fTF6HM5Inmv2Jyqnq/L1iZSR/9NVJt3DRUfbox2YmTMDQ6jYyGQghsBxCMKohqGYAzZDZET6RxwSBkZba"
    "50CD1BN5kJyZ9RgWjpTRrdM8ZcL9yON3Qilm8WwSAdm8jS28R60WAaUZV9wyM/PpISwvZ74dt6UsLQ3IfuJINTP+Q0PK51QA"
    "jzKxR8AHxR8duVVvdzGtPl8UU21RFv/WYdCyxMR2IdJTwKNkkopejeeyj/FNKuoGdi3Jeqs6nicoV/x8f7gxxRsJh2+RpZLJ"
    "2ChQTc7AvpV/aLnVhWTPYn1CwiRxUoSXtmyBCC3jDvFxAkLR632Vw9S5ETelgJX9mJe/3EXGepVFp2Rh25hcprLNANyLD2+J"
    "3ez35YhMVZ+zfhaZVW2uJYznsLusugsNZXFYu0LcdZE1sKLVCTL5H9RNZQUT9G3Ug15CH/GgMLo2q8lblkPJjBDPlZfxFvaO"
    "Q/K5PfEZT0C/x0m+WllD8NCFN/vRMJJPB4nY22NvmUvDS5jt3q+BRMHC2mbRfoDrvO3tLmwQRt2ak1n0N15qGfMxoLpsD/fI"
    "IFJxhQKlM9RRGnoHmCmq4LxoMuflbzfgmM5xDh3CTAldVDPVihpgPOCTF+ELdQi7dbFIzXsmus/98WI3ji6LEQJ9lk1AQdmz"
    "Tgx8yVPm7Av3Q7AJDPX9JwQs/gb1mu4VOMP5TdOczwMCVcO31a/NVKM42DRvBPuQ3/KgNkbQ94vMOoej5izQ++k2IRVyozAG"
    "hzMhzJa/4W4ypl7Z8/2uuRQB+bBjpHegdKE5VqMXIK9msYjgMTp0nlvhrWNvRA/I8zmy11NeOGTneD5TFBML+jdn0PIPpCwo"
    "EumAvBZtbe6VHeit3bkCFWDnMlTrbsPD0CRoPEhb/d4AAAAAIOXbX+zJjtcAAf0z4KYBAOdNSZ6xxGf7AgAAAAAEWVo="
)
SE_1 = {
    (25, 0): (0.0036, 0.0054), (25, 1): (0.0043, 0.0059), (25, 2): (0.0027, 0.0053), (25, 3): (0.0034, 0.0049),
    (25, 4): (0.0053, 0.0044), (25, 5): (0.0023, 0.0055), (25, 6): (0.0042, 0.0056), (25, 7): (0.0054, 0.0073),
    (25, 8): (0.0071, 0.0077), (25, 9): (0.0085, 0.0144), (35, 0): (0.0050, 0.0037), (35, 1): (0.0035, 0.0043),
    (35, 2): (0.0036, 0.0053), (35, 3): (0.0030, 0.0026), (35, 4): (0.0043, 0.0042), (35, 5): (0.0053, 0.0035),
    (35, 6): (0.0034, 0.0025), (35, 7): (0.0032, 0.0030), (35, 8): (0.0039, 0.0040), (35, 9): (0.0066, 0.0035),
    (35, 10): (0.0040, 0.0044), (50, 0): (0.0039, 0.0015), (50, 1): (0.0028, 0.0031), (50, 2): (0.0025, 0.0027),
    (50, 3): (0.0037, 0.0052), (50, 4): (0.0038, 0.0025), (50, 5): (0.0043, 0.0015), (50, 6): (0.0058, 0.0037),
    (50, 7): (0.0040, 0.0040), (50, 8): (0.0035, 0.0038), (50, 9): (0.0026, 0.0023), (50, 10): (0.0038, 0.0041),
    (50, 11): (0.0041, 0.0031), (75, 0): (0.0047, 0.0040), (75, 1): (0.0043, 0.0044), (75, 2): (0.0043, 0.0038),
    (75, 3): (0.0049, 0.0035), (75, 4): (0.0046, 0.0040), (75, 5): (0.0027, 0.0037), (75, 6): (0.0038, 0.0035),
    (75, 7): (0.0039, 0.0036), (75, 8): (0.0030, 0.0035), (75, 9): (0.0036, 0.0035), (75, 10): (0.0023, 0.0010),
    (75, 11): (0.0024, 0.0031), (75, 12): (0.0025, 0.0025), (110, 0): (0.0035, 0.0018), (110, 1): (0.0033, 0.0030),
    (110, 2): (0.0038, 0.0026), (110, 3): (0.0035, 0.0031), (110, 4): (0.0040, 0.0046), (110, 5): (0.0035, 0.0027),
    (110, 6): (0.0030, 0.0040), (110, 7): (0.0026, 0.0037), (110, 8): (0.0034, 0.0035), (110, 9): (0.0032, 0.0033),
    (110, 10): (0.0029, 0.0017), (110, 11): (0.0034, 0.0024), (110, 12): (0.0048, 0.0026), (110, 13): (0.0044, 0.0026),
    (160, 0): (0.0046, 0.0037), (160, 1): (0.0052, 0.0038), (160, 2): (0.0056, 0.0032), (160, 3): (0.0035, 0.0030),
    (160, 4): (0.0051, 0.0025), (160, 5): (0.0044, 0.0021), (160, 6): (0.0045, 0.0022), (160, 7): (0.0038, 0.0042),
    (160, 8): (0.0039, 0.0040), (160, 9): (0.0035, 0.0033), (160, 10): (0.0038, 0.0032), (160, 11): (0.0046, 0.0037),
    (160, 12): (0.0036, 0.0023), (160, 13): (0.0038, 0.0026), (160, 14): (0.0040, 0.0036), (160, 15): (0.0040, 0.0040),
    (250, 0): (0.0020, 0.0022), (250, 1): (0.0030, 0.0021), (250, 2): (0.0027, 0.0022), (250, 3): (0.0024, 0.0013),
    (250, 4): (0.0029, 0.0024), (250, 5): (0.0031, 0.0020), (250, 6): (0.0030, 0.0026), (250, 7): (0.0039, 0.0037),
    (250, 8): (0.0037, 0.0030), (250, 9): (0.0038, 0.0021), (250, 10): (0.0033, 0.0019), (250, 11): (0.0033, 0.0025),
    (250, 12): (0.0037, 0.0033), (250, 13): (0.0031, 0.0032), (250, 14): (0.0035, 0.0032), (250, 15): (0.0037, 0.0029),
}
