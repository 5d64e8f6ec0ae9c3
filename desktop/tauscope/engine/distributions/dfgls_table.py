"""Written by ``python -m tauscope.engine.distributions.dfgls_table_make`` (do not edit).

Quantiles of the DF-GLS t ratio (constant, trend) from 1,000,000 random walks per (length, lag)
cell, seed 19790601; decoded by :func:`tauscope.engine.distributions.exact_grid.decode`.  SE_1:
batch-means standard errors of the 1% quantile (constant, trend).
"""

REPS = 1000000
CELLS = (
    (25, 0), (25, 1), (25, 2), (25, 3), (25, 4), (25, 5), (25, 6), (25, 7),
    (25, 8), (30, 0), (30, 1), (30, 2), (30, 3), (30, 4), (30, 5), (30, 6),
    (30, 7), (30, 8), (30, 9), (35, 0), (35, 1), (35, 2), (35, 3), (35, 4),
    (35, 5), (35, 6), (35, 7), (35, 8), (35, 9), (40, 0), (40, 1), (40, 2),
    (40, 3), (40, 4), (40, 5), (40, 6), (40, 7), (40, 8), (40, 9), (40, 10),
    (50, 0), (50, 1), (50, 2), (50, 3), (50, 4), (50, 5), (50, 6), (50, 7),
    (50, 8), (50, 9), (50, 10), (50, 11), (75, 0), (75, 1), (75, 2), (75, 3),
    (75, 4), (75, 5), (75, 6), (75, 7), (75, 8), (75, 9), (75, 10), (75, 11),
    (75, 12), (110, 0), (110, 1), (110, 2), (110, 3), (110, 4), (110, 5), (110, 6),
    (110, 7), (110, 8), (110, 9), (110, 10), (110, 11), (110, 12), (110, 13), (160, 0),
    (160, 1), (160, 2), (160, 3), (160, 4), (160, 5), (160, 6), (160, 7), (160, 8),
    (160, 9), (160, 10), (160, 11), (160, 12), (160, 13), (160, 14), (160, 15), (250, 0),
    (250, 1), (250, 2), (250, 3), (250, 4), (250, 5), (250, 6), (250, 7), (250, 8),
    (250, 9), (250, 10), (250, 11), (250, 12), (250, 13), (250, 14), (250, 15),
)
DATA = (
    "/Td6WFoAAATm1rRGAgAhARwAAAAQz1jM4GSXHx5dAEyYW/iYBn6OoFjwSozIgR9H/MY00OZeibRrzPfBFqQqyaBsqMh9YDx/"
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
    "0dymfdrkrCdnWtPVEb/lVBJiYE4bpwrc+fX9bQc0eCi5S9X8vQKG83MyOoiXZTWbbIWu0Y+oEzTETGsPN49g45QC4sq1eSoW"
    "jngnFNMh/7jJG6sT3IaYdrlgDbSdK6oxh+K1lGgqW6V63kF3OTYumEynXIQVV+NX2l6ENBv0YXuETWgB4HnQmj05pIaZdiTU"
    "DtOhiEF2lJ9p7fKsEWD7apB8/H8UB4B8DijzvayMQ15UNLD26chBs4QUx+cSHcJ6e0VLq18yGZe+w5RmkH7tJ0SS47mTYnTG"
    "d48d1i5n3W4R5ul/QmyNYNhKGkhozdhhCCb6GP8Jd1wDnBR5+lDdpUR1hpUhz7OxQiHCkIXAH3m0Qx+MTJBJ0gItD3u5KOdB"
    "xxHP5IW388U4HwOIy9svB4tSZ7QS9Y53GjHBUHFNDpaME/xTztqY6ipcLO41udXPt546cNRNc58p1In8Gqhd2oFxWakFLyh0"
    "DKlV3FL2jovUyjKGXjgQrSAzzpKd3blK8pxb5Dx0NAYJPFjGbI6tM03zkXyaX7+uMLk8WWU3I7GrXv7zHVIa36eaqeTbcEkh"
    "LC6DIUdme1zbwxVj6j3rSa4LGrGk89sKjmpS1VV8oQ/CjKVybYS+u1dytz23yxlodyS2pLgrLztOF+HbyaV5WMjJ3JiSotX3"
    "Ks2MWKs9xikjfLQk4Ys2EB/hYo7XlhaQrY6vD+N1HkN9YmmPlFhz0j3rvCYA3vWc7jnfADEUyZuRNgGkirh5WLoM39zfRyJ5"
    "FqYzeizj56S2J928ApflInXB8RoXBMhTQwk/1M6yf9xh/wCqlbFksgll0k9ecU5GJ/R8ovqzar8ENcapc6krWcqPmtlbBZp5"
    "pikFFNQ3iHHfAetWzKUyPQqKDGSh25JevLUDb3buuIe/ho2mvObiKfXmj0cWNshrcNVrVqQLMc3tvyVz2ukBbsKfJ4cnDXqb"
    "Z7ZrfCtCOrsATx/2NE2Y8DAPF3zrPP4TWj1GTdFatrpahjoDIGvrORf7hhphnZ7I3k3aFUzco3g1z1kXffA0mJcgiCzlK8ZZ"
    "VcV2U4/qWVABsg1qUJqyFRvP/3+xWd3LmZeSUe9GuRK7p+a6bgtuqeAL9CHikmhxwOQzi/fduL2EzR579fIAd64+9An5T+bY"
    "g9o6D9EcYsRk8qiJKdRJrBLgsVeJkOleu55SW91l10Cm6EJu4asPFElesXbtvmwq5nNDDtogIrSjumkXm9iba1QHuxfIvgju"
    "7yllvhJGd9fDmAfPNTRZOG63WipfPfOalsUXDoi9t/tZX+Eh8ajikuPl/fBOwv8/53JDltEFPp6zMr3g6ayzNYfvjgOl7zOe"
    "APBsi2U+vvBVTkNsHg5wAO/9MEzPq1YBmZeZ1Rmqi1doqTpkBIQk3lfLForSo4NccRNfAYQF59KJwAJ5KnJ1n7GjSO1kjSZh"
    "9EDUizXUeXgxGIvKjoir9kf+jXqIxnzSKYP1mkwKZPo/9IrNVqFwZhvrbhUFQaWHbopVPelSRfzEE7rGQBSPkw0ibyRiJdtr"
    "eAegrA9703MMZ9xiKbMrnCFKEFB6XoGu6s5+we8qhF4Cq7xQ+pZ/U3nOFPZo7bahXUYUoOTJyh6cCvoxZhonNmCGSXJKG0V2"
    "q95eBOpMMlEL2f7tSlRTmeyIwmq66u9vOjo92u3B+Kjs1fhvZMHJrzavMDq7ZRmjOiH6sCT+kOg9o58kGuQsEXytsRoWUA/H"
    "G7N6AiR0GBZ1HajEVrwaDC10hxE64XkhA/B3QPoLNnxn+5ASw59TA4JwQ0dnktDrMtRhX1mYkyeU4g+fC5MhYWSh3AHd/GxD"
    "3w59B6svdnkTa25kVULbSxD+6WmZCe6Ci48DvcMDJn7Th/3N2dO+VqZPAZdVBmk+kehYRTkvAPyyRc022kPkcKxQduKqHW7w"
    "juKy6msv/AY+twBwotFWnKrKGmGkIqdwcz0WN+ajMdx9pnWWrx03vM/4HnGqwNBSKTyUPPlGnymdfs7XCzal80c2KPN0UkmR"
    "1t/N6aRTUVVL9JwKHn9m3IH9yJjZn+pPEKo+fXi9ab5SE+W2X4JbM3svbu816E7XpuJfP1piSXw19DvQ598F8QshWs/wPscN"
    "phrwmv0g/nlfYzYkpak5sIlsHSVHwd9S2+6PyU0I2uwjWY5EhuxUfqLbzimPDrcxrz2hUfjtMxelMYn3TW15fZEQtxswPqyI"
    "QShxhbMble99BkVFnTG5nvrBNJQD5eL8jzIweDijk+yK3a/usNURC3770IRzZoFv6lc6BcvryuWYXsTXkc+E6Xtp3JgU6kC3"
    "K7cz9rfN0WlyFvcNpcHsvTYuer1rpOAwU71iDH8aO261nw8t716+XhJqEe5BQ4f02IxIe3Wa/sxjk59/f38MvaAXhQRf6Yuu"
    "c/GXmLWYJRLIro/UCRBdxVfEtsI14CQLxdT8jecTSsDDdz6rgl+p10A1yO5vUZrP2iSiehllxog9ws9K4Sv0jptLWLBmZspB"
    "KOKt2jnIc+R8/RZY0YbWTjJFG4NadRMtdEPCaJYyx5wwD4J9NNe/TRl/1WxrDUHV78yMuNlqxup0XyU7RhNUPL+GXGl2bpDv"
    "oVAjU/LaeyESI9wt1UWr5uAVGKpyOF33u5IdU9k/OYLu54HNapG4je8IyUiuO8YvzE14yjfTlYDQ9xKscK19/lVtWRgMB+UT"
    "kR7/kZpwBk7b8yZo8XWZYIg3kdadZWmtNwJEAfaMn6evvIA0AokWsm+knCAgAh0E+nfCMwS3jjkKNV3WZE7t3MKnQLsxJeVJ"
    "rXoKt6xyv6MgVIHbuJB6t95R58ra1AMi4Kyepk2XaSfQU0DfoDmN5708torV5O13q82rTaEOZBWFav/1Yj01DgDiDR5l4W38"
    "fvfkLbxSRWXm6efZgLkwDmX9mjZSF2Otn43Tv8CGwXQratXEnPP3HLRzymx/3lWnKatdx6JogdNLGv9k2rvpzRx1gMZk0m21"
    "kng1cEZzvxbrEgV4WkZdge8jv9W8RK/Wbs6jA/Km9bD4yd5j0zTrpkLyPXbGCtWbMsmuy8rphCSQIOEnf+6asKRmRx7i+NFi"
    "rM9aeswDmVenACT7QFjJbCpIcvgooiOZMUOp/E8hK99pTvEK+T7SYNV1sxCgI1jFQZZoTslyctrWmLz0GtMZbN3UVCrckgbj"
    "zahbtApyA3q840Pqi2KuJEi30tJ1Gand5RL/SO5p+LhOa0Z9XxKH9cEZMv6LjxBeiNYefdPAIutZGMCDjVVX2SYOos2ZQu2a"
    "550StSgWsWTGQzlZr/Ooklb3QW3yWnZTlaOG1Gy0EgyQBmsX4dOwFyT1GicfLsG4/7nmmRoG7dHrEjXa6UAwT5b1+DGXdQZj"
    "f5Alg9WWVavfTe1xptDpNqDeeUDQN+n3hiS8/O80LwIsKvG9VsIdbRPNi3BJP8Tb73UPVKlES6sI4A/KmCRh9CA8bKGYk+Mo"
    "pXy7uPVCE9b1HFHIc4uyc0h0ryuccxUmBVGdcWBsmGSS/tr/4bPeypei2iVCh+HuFA4+m2qhdoUutdy0erjEPyQuvEyn9QAm"
    "fBz6Kv3XdBOBCXp1iOy96gmx3xRpIk8JTaWs4wsqh2ENs54wwpZU516jt51A6FA1lmpBILNmXzPdZzK/CkyId3mO1SlPYSbd"
    "F4rOsf9vYRpKg/BH1DxhWdG6DF+AEei6mNb+CMoi8e5Wyg9BU81fu49ErHGnr/L0stWR9WW6gBPx3NDqoqbtP1vcMjhrxNHa"
    "WFCBnspEW30ps+awNLMjkp+KV+HWqG3SKty/fRIljjRT13N2FAPe/M+h7Vavz8AANHlqL/KKz7Kv3Ve5bt+pnVjw19NjJnlL"
    "ACEu6IKUvI6R8GHklan82hFbD0/kljXP0ujS7Vk2sS1OVur+drI+/kug8PdPFDo1kGSA6Qfe5/dnuxnIwo7bFaZ39pXUTsoA"
    "pXOe6O7ne2zxlv6IvbEeMilKWrOWereWSznSEfIQvPL4U5dY6Z4XxSYJ+sMpCXcyoFwQMq0auh22WCPhAvW42qfBAg3p9Brs"
    "1V7QcamBxFl6LWIkihAsCkNP3JzFocKRuDAObYannMGdUrGfpI0XP7mykw1vC9EXX2p7UL/3m3NEcdyBlKyf/9f2PI9RVmcH"
    "75W+IyT0lb73d/Lw69xrQ0ujTQnqRkzR+SL+VVOUntYVNEEri1Z9Omqo2kQF422SulOWOmPsfn90WfMpCMGFV4oxWM7peTa4"
    "TXGCeoJgeSk1W6TrWjDRhGqNL1fdDuE95Rqfi1GIb/RuFRvqVBgpFwxiJYclvgh9Ykx3uoPZtomjWqEm4V7wxENZGzaCsOp3"
    "CEMeZkuIqoMNoWgqsTKsT9LjiwmCrr5kSsfymSIjjG2Igt+TRU+Sh6mb7JAUx06G9sgZtE4IWC6gULsAFDONOlcgXixF8PH4"
    "5Bf02Cc1nM08Hb6eb0V25MvqiM/qJURW1SFGzmBgBY+8aGCb2HtjXnIbfyBhHVYGBOl+FU/1/Y4lAQbpGGGznSfLEQdcHUGw"
    "WW6GM77MQWIy6VU3pkv/aOUQQf+mRlEH//tx7RoziIrviPfxzGsVGZtJaW9NXGOE3D/5oLbRgozK8+waRmH1SLzZZQM6HdB6"
    "+Pd1GMO6fWsau5REKsZU4OdVCzsHJWT6XLaUn0jXxUkAbHjhg//oSnZm0d6/WbDPUQ6M/j7ZEXOkerSglT38MpTVV0QKOxA7"
    "TQ04wiH6B5z5DGRTeg0XHpO/h0cnH8A71tem4gFrdXNAFRrFUU+8qXSSPHn3xNL5CyIGTxdAjZiCysPqHraoajafP6cSS1Dv"
    "aRNwTCZMlEf+HoXXPPiTN0JeCD/5RcChMdIhIY+hSTBmtZ+w9SFqe2GTMvjC/5wE2pQalya2NYDNOianO2q5rTNjaV34wCsf"
    "I4WoHVurxjyDtDFdBWScoIN6ayiIF2NIbcpVmtgKu4jn7nv5omB1nuwktdpbuWo0N5RH08nhwwQxIGkgqsGysNDOXNaDGI5R"
    "WUO0rkQqkHKfgqvHPkmYZNcXMI9jr2s6Ijusn+dY5v/jD6XoKQ/0+rdqZjAT22dTKer7Nh9OgszsGDRdoXxD7yiuZT2x0thV"
    "/CEbIVx5FSa6+HodGWiMcxMahECt1Mx00WnxLA0l1UeKhQP1BTn3AAIWL7PZ1mMnNkl7YqYwyoksjlaL8/46aRgcXix8zSk2"
    "5kJMVNjDlfCXnWYrHStzoiQLc60N0cOJ5dZlAMFBKcSh0CZsEuZAnqR56dsU1bwXcqSMdTw3QDeYdV4L9uMuil6UgoVGUr/G"
    "LaspTBfEuK14ByCcxqOH7dyWih5rSbvVeyzR5JSQqAMyhImRir+/pZnIcDBbr1r2iVeAOXMbDXjk8fZ7U6MRDidNnFlwOuXu"
    "tbwwnIcJgqFtCTS3YvNvRZLnZmK5vcXJbMQcjMi6gj/2srDBfcUnypRs+HEdk8sy7QnK0BYkISVKrDyMA/nTXbxFTO/v4Pu9"
    "1L4XDj5joVFg18/TRjD/+Q7NzULY9vezy4KX9L9dUQyA1zT99O75eduBeZQbJm1rBDW8ovFmsJueX2/SK0y1S7xKlDd6Yw72"
    "FnQyq4VkQJ+tXpVhGuPNMFxgkBqQoUQrgAnvS5VI4+DIOGIOIr6oNakURSgDvWBMo62VCGku9GI9zLHF2Zbh/fER3KfrM0Xl"
    "H1SbOxcYDhmt/9wmbq/OmhEMXBcoy0NLtmRlLZiifiJIWWUhhYClMBs/lukvbwTM0R8gDHqaMH+FW1P4437IDxr1bh+McCul"
    "sB2c/QKXASG6ZyHOs0CgxCdGP2geHLTHgKX6H/dBE0mxgtD72Fhz4I9HmTx5uhJtGjwe2Nqh0MnEIhgx3Hm2JeGrEK0NUAaC"
    "V/iSuOWWRXYahbJ56ysCQiKfOmLMXP5BRO/5yoLysvTB6B6ScdLpUk0baP6ucGn0OdTLpev6TAatnGGN+TePV3KiWjWOktKk"
    "m6m6xljUkd9f7PRLd46uk7wY5w7fNBb856/Sq1kZ+r1decuDbStldEP0X0MCrRacnv/k/N+0LmGq1Nv4Zj2V1PAA2xHbdZxo"
    "WPbFr/CHj0+Jx6Epeq+j57dBuNfvl7gNu8h1vizrsUfCoDyneIRG+b+a40/zvgh5gepzwvdgjl2J7+FhK2o0FJdGcR/g82Ev"
    "hc2yrMRMXXcW2VhLO1KOg7sK6Hs5NTK6GFI2alzAq3HheiNJXfBEg7+hivmZCBI9Hna7Pu0wrXZen1o+J/ilztrnrRiztMKY"
    "Whev79mwFa0MiakER1sUynJ3AZRRNzr598nrZF4hG6foKTLZ0181hnMSzoeNDj0YWKAbSFUifTOpDazd6ikq91c7qyHOMihL"
    "ZKwhKSw5lrd3jAPJyGISlWgMQZfmEhe2UAO9TdUCqh7HLEFmGA/6vKn4Cz+WXtpnyNd0oCfCyMPCHks1Yfgt8tilsc/LbnNS"
    "99SJK+ncB/UFPHclra/6loLS8IiKaQ5bqY9KDFZx41FFtnBFMpWzOjyTkFANc8cg1KgPhxXtWSJDY2ygsDHaXBrUU4RFGgCT"
    "fczhvOdKBTZQiebQZ71x/HPyT/6mdOQZ97QEbSNQYArPRltbGRnBKCakRm15YzzYVdzgpUNAWuhIdDM1ZQj8uwnYLlVE6Z7b"
    "Zqtm2auY1nnyDw8dKJu6XwdT7IZohT21peufD31OdxTlU/uCGsOMXSQ2RoOk2va9y0oBTwSkmlQv1pmGEY3x6PKzP7tfKGKE"
    "K8qVltPOCJw3FJW48gMG94qFalwfvpuAfKbMisqvnNN2pLDPIZEpbp1REnXZKIqS6HhbKAlowtzT+yqTeVg2DUPqWDpn/pc/"
    "guxFoLY4ODAIf7uo1jTte70KOojfaBqYfcnHLNJ5EgTiAIyYqS4PzpMBtze2RteIkjZJxubdY4B0TkSj5aCuC2FbEd5PaiF5"
    "pBaKJixnb6HuovF2H9y1HprTtcnaEluhaEO3Rh+ki6n6rTbye4GDdAtC3Uhsj3xNZbQPok/+thYyVurHM9DJntvkifTRo0+4"
    "JaxnA398h2g9QDgbOuTRH/sq1hgjq/YIer1EXQlFppsSMoEm+09tOQHm3c10qM58yEhEsbLJaF1ZpS6PFPLEuXlJ/2dp7qkN"
    "4tkoUtJ+NutzubSJgRSH5UbAQ+G3t/arsvD5DU6sCjL9BC7rGDJ6pspJTjsKEu34Wq98Q3JgrqbS2MmkCqqF2kD+azt+42Uy"
    "1kw0L4cFdOMCQs1Zryecg2WyDAHkNbuICL3Fq7WgfTa8P4FxaCuvyyIYhbOvw4VM2foZild5TfUFMaI5i1Fyror4KhtIF4eJ"
    "/UUJwFJ4KWkyKGevn7pvjWmG7O2bNOGrpy6YLq4jzrFEJh+MCxfGR489YN1/KPSyYlTrGl6ELB+x53PuO0RTRIAkIINqkKb4"
    "YwoOVIfrx9WHBAbJyq3TweEPm5APiEMLLisdNwUZ07sovCpnGy18EVeCsaZ9+lqJocxhDsV+ms06dGixrvLxFRFecxj9CJ8N"
    "L72LCcSyLfoKAjQzW6pkQtIBaGZ3bj4l2luOKrsyOf3vV/SbtapgaGGvkc+TY6mCDOcrsluwQ9RvevSrBIljzQbPq/jvReG7"
    "tB5yesujOrL9FJN9P2i947xZyyWufTHx/F51nPjtuS5ZGOflbPOoZ3Ol7z1ewCh3tVdDwi0NUyk4NiZlh9FstAW+Ql0hheZ3"
    "nqJkn3jdPr+na6Nutk5XHqnKborDu81N4ny1arONixqiJFEg7lnrxdfe0HJlN1uDa2LqZNZ7UQxU02dXx2uB09chgvVC7Cme"
    "xfGnMw3ftqyK0VRNFtwzxX3HVQfbRCgLHEZ1smPhbnuSr6gOYXBxNZo++B5et+RM+A91apW4CUKHS3K9wDaADfssblFPEb6t"
    "2xcG082vQ3j8QmiQ1y0Fa1+EiYfP3objr7ATIIZ/qSBsQL9LK3IRfEWP5ihHUP0luqhqoflU0X1xgN0Q4u3sZ2/RBF79PDpI"
    "XcbK8/vXHqIZBmdqAXFBjjmB6sr3YWBk25DE0f1gG+cbzJsfcj94Zgq7iGddU49UqdZ1FPVeXGMB1AeeTO3tq56McJvxeOd7"
    "c7MBNzx9RsZB9vowlanCV0IehPT02xK8+fNzPeIA0drMzt1apW8Sd8+y1kxQVnE8u9jppvJkWQy5xSM+yEkTyjT6vGCBRO/1"
    "Zahwoh8lxkZ+rwMqW8f7RuztGLMQII0TtmOPL4IT5HNbZjFwaVcK8Muomw+Gtr0dqMdosGdXGEu2o2QlllzXwDEI08srRj2l"
    "nwem/IGieP0qfcXbwX8eK2NxCOg4mChY1T6/bco1x03lU5Ly3O+vnTxgX3C0TXE8Y6IokwN5jd65Cjzv/oBYqkT7QALLu3fj"
    "ElAb5VJ16+zdE4VEZzd9YpSHZSQ6mFA0tdVjyTq5e+h3WUpra3KUZeYD+1PY1ZyK7YeiG4rhiTHRYgb26UAR2kYSjM0vyWi2"
    "flN8b1sTvWOil/UUKXYmqHvMeRdbFMQ+kPUIxb6pKeUoElyP55zuLoDgXso3o/rsZqYhH3zN0j5QqrVxpNcXsMsvn13WDh5B"
    "mopps4NQtURkmLEQe5QCjfh5bJQuVnYrR5sUHlDNyRMHm9SZSvms5PUaEoZ/LF89QyWiBJ9p4qQkJAcwA9Uz1qRNAyojevn5"
    "NXiIPPd8LJWmg8RMtDZ06H3+S95l7ICIiNbXxjffGhFr3rKI6Ee0OKMWKHwNArz9gFp8chR2p/QnN4/d2JaGypGSj6m1zUyu"
    "hHOpL/GzCYL3b+ThPFLVpS6rqc7r4h1Mjvxe+DEFFMOGS1sskUe6LnC/4tVox2UkmtqpJHDvophYz0+HEmw9OdcvA0Do8/GS"
    "/3WQhSNBlN3Uj4E7aOx5rBgu1JjwBTJiclVy8tQJwxEUPiIVmb8PVcv4x+yD75uzSZawgWAMcHlQU6SXAPyxa1xWvQypWt4N"
    "i3in/FUO3wT6+oX4e5I0+3YFZ79+wY7K7ew8hQB+S+HrUiTLEA4dkDFNj26LBHcEXV/JdGiBP1N2WcXErzGwygSg9LPDsQrb"
    "amhLQ9c6itjYHyiY0er/rwO2vyPGWW5Ytkk4wDTHDK1v4bBVIjNsbWlXMRcXfXc/UGHB5eyv86nCfa8J1QJT516lJ4jR1ZRl"
    "YBuNUq2NuTnCMsURSy+VE4LU/mGBdHEMf74E06x5LuOa/a0120uKhOSA4Gn1a3mhttWZ0sRz2U5mMZ/HWg3WIbLWPcCjfieM"
    "pAyiU+TrKcdXIHmUKzXYptu4CM+VMSLTaJASqLuQsu3Nnw5n0THk5SYtnde3/v3PQGAImT3mul7YbviwbG5ddvNwobNCAP2a"
    "P/A/jrRiBYyNs3cGNr4bDOlLhlqtzSHdcJhOG/ZA1MFHKYdP6FUZQ7hT4iBWbs8U+dAAiLWYe+sjibwb0kx2mGv0bt0UdxFb"
    "DckuW5AAAACC295ymEpkMAABuj6YyQEA7LeEmbHEZ/sCAAAAAARZWg=="
)
SE_1 = {
    (25, 0): (0.0036, 0.0054), (25, 1): (0.0043, 0.0059), (25, 2): (0.0027, 0.0053), (25, 3): (0.0034, 0.0049),
    (25, 4): (0.0053, 0.0044), (25, 5): (0.0023, 0.0055), (25, 6): (0.0042, 0.0056), (25, 7): (0.0054, 0.0073),
    (25, 8): (0.0071, 0.0077), (30, 0): (0.0035, 0.0028), (30, 1): (0.0027, 0.0041), (30, 2): (0.0040, 0.0034),
    (30, 3): (0.0044, 0.0029), (30, 4): (0.0028, 0.0022), (30, 5): (0.0029, 0.0037), (30, 6): (0.0048, 0.0037),
    (30, 7): (0.0078, 0.0045), (30, 8): (0.0046, 0.0048), (30, 9): (0.0042, 0.0076), (35, 0): (0.0050, 0.0037),
    (35, 1): (0.0035, 0.0043), (35, 2): (0.0036, 0.0053), (35, 3): (0.0030, 0.0026), (35, 4): (0.0043, 0.0042),
    (35, 5): (0.0053, 0.0035), (35, 6): (0.0034, 0.0025), (35, 7): (0.0032, 0.0030), (35, 8): (0.0039, 0.0040),
    (35, 9): (0.0066, 0.0035), (40, 0): (0.0046, 0.0047), (40, 1): (0.0035, 0.0030), (40, 2): (0.0035, 0.0022),
    (40, 3): (0.0035, 0.0033), (40, 4): (0.0035, 0.0046), (40, 5): (0.0034, 0.0045), (40, 6): (0.0032, 0.0038),
    (40, 7): (0.0030, 0.0035), (40, 8): (0.0033, 0.0039), (40, 9): (0.0035, 0.0044), (40, 10): (0.0023, 0.0029),
    (50, 0): (0.0039, 0.0015), (50, 1): (0.0028, 0.0031), (50, 2): (0.0025, 0.0027), (50, 3): (0.0037, 0.0052),
    (50, 4): (0.0038, 0.0025), (50, 5): (0.0043, 0.0015), (50, 6): (0.0058, 0.0037), (50, 7): (0.0040, 0.0040),
    (50, 8): (0.0035, 0.0038), (50, 9): (0.0026, 0.0023), (50, 10): (0.0038, 0.0041), (50, 11): (0.0041, 0.0031),
    (75, 0): (0.0047, 0.0040), (75, 1): (0.0043, 0.0044), (75, 2): (0.0043, 0.0038), (75, 3): (0.0049, 0.0035),
    (75, 4): (0.0046, 0.0040), (75, 5): (0.0027, 0.0037), (75, 6): (0.0038, 0.0035), (75, 7): (0.0039, 0.0036),
    (75, 8): (0.0030, 0.0035), (75, 9): (0.0036, 0.0035), (75, 10): (0.0023, 0.0010), (75, 11): (0.0024, 0.0031),
    (75, 12): (0.0025, 0.0025), (110, 0): (0.0035, 0.0018), (110, 1): (0.0033, 0.0030), (110, 2): (0.0038, 0.0026),
    (110, 3): (0.0035, 0.0031), (110, 4): (0.0040, 0.0046), (110, 5): (0.0035, 0.0027), (110, 6): (0.0030, 0.0040),
    (110, 7): (0.0026, 0.0037), (110, 8): (0.0034, 0.0035), (110, 9): (0.0032, 0.0033), (110, 10): (0.0029, 0.0017),
    (110, 11): (0.0034, 0.0024), (110, 12): (0.0048, 0.0026), (110, 13): (0.0044, 0.0026), (160, 0): (0.0046, 0.0037),
    (160, 1): (0.0052, 0.0038), (160, 2): (0.0056, 0.0032), (160, 3): (0.0035, 0.0030), (160, 4): (0.0051, 0.0025),
    (160, 5): (0.0044, 0.0021), (160, 6): (0.0045, 0.0022), (160, 7): (0.0038, 0.0042), (160, 8): (0.0039, 0.0040),
    (160, 9): (0.0035, 0.0033), (160, 10): (0.0038, 0.0032), (160, 11): (0.0046, 0.0037), (160, 12): (0.0036, 0.0023),
    (160, 13): (0.0038, 0.0026), (160, 14): (0.0040, 0.0036), (160, 15): (0.0040, 0.0040), (250, 0): (0.0020, 0.0022),
    (250, 1): (0.0030, 0.0021), (250, 2): (0.0027, 0.0022), (250, 3): (0.0024, 0.0013), (250, 4): (0.0029, 0.0024),
    (250, 5): (0.0031, 0.0020), (250, 6): (0.0030, 0.0026), (250, 7): (0.0039, 0.0037), (250, 8): (0.0037, 0.0030),
    (250, 9): (0.0038, 0.0021), (250, 10): (0.0033, 0.0019), (250, 11): (0.0033, 0.0025), (250, 12): (0.0037, 0.0033),
    (250, 13): (0.0031, 0.0032), (250, 14): (0.0035, 0.0032), (250, 15): (0.0037, 0.0029),
}
