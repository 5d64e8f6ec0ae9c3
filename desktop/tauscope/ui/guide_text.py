"""The built-in guide (offline), as HTML.  Anchors are used by tooltips, F1 and links."""

from __future__ import annotations

from tauscope.engine.reading.grade import MA_CANCEL_BELOW
from tauscope.engine.reading.words import CROSS_CHECK_WORDS, cross_check_meaning
from tauscope.engine.unitroot.union_components import SHORT_LENGTH, SHORT_MIN_LAG

MA_CANCEL_BELOW_TEXT = f"{MA_CANCEL_BELOW:.2f}".replace("-", "\u2212")  # a true minus sign

SECTIONS = (
    ("start", "Getting started"),
    ("sequence", "What the testing sequence does"),
    ("strategy", "How the verdict is decided: size-controlled or classic"),
    ("seasons", "Seasons: fixed seasonal means and seasonal unit roots"),
    ("tau", "τ: the ADF unit-root statistic"),
    ("phi", "Φ1, Φ2, Φ3: the joint tests"),
    ("z", "z: when the normal distribution applies"),
    ("kpss", "The KPSS cross-check"),
    ("pp", "Phillips-Perron: correcting for autocorrelation"),
    ("dfgls", "DF-GLS: more power near a unit root"),
    ("za", "Zivot-Andrews: allowing one break"),
    ("exact", "Exact critical values for your sample size"),
    ("power", "Power: how often a stationary series is recognised"),
    ("lags", "Lag order and how it is chosen"),
    ("critical", "Critical values"),
    ("pvalues", "p-values"),
    ("decisions", "Decisions: rejected and not rejected"),
    ("verdicts", "The verdicts"),
    ("regression", "The regression behind a step"),
    ("statistics", "The statistics at a glance"),
    ("chart-data", "Chart: Data"),
    ("chart-fitted", "Chart: Fitted path"),
    ("chart-lags", "Chart: Lags"),
    ("chart-recursive", "Chart: Over time"),
    ("chart-null", "Chart: Null distribution"),
    ("settings", "Settings"),
    ("references", "References"),
)



def _cross_check_list() -> str:
    """The Cross-check column's words and what each means (from the one vocabulary)."""
    items = "".join(f"<li><b>{word}</b>: {cross_check_meaning(value)}</li>"
                    for value, word in CROSS_CHECK_WORDS.items())
    return f"<ul>{items}</ul>"


_BODY = {
    "start": """
<p>Open a workbook (<b>Ctrl+O</b>, or drag files onto the window). Its sheets and series appear
in the <b>Series</b> panel with a small drawing of each. Select the series you want (Ctrl+A for
all), press <b>F5</b>, and the verdicts arrive one series at a time in the <b>Findings</b> panel.
<b>Esc</b> stops a run; the results already in are kept. Pick a row to see its chart in the
<b>Chart</b> panel and its plain-language note in the <b>Reading</b> panel. <b>Ctrl+C</b> copies
the selected findings as a table that pastes into a spreadsheet or a word processor;
<b>File → Export findings</b> (<b>Ctrl+E</b>) writes them all to Excel, CSV, JSON, LaTeX, a web page
or PDF; Excel, the web page and the PDF hold each series' <b>Fitted path</b> chart (its
<b>Data</b> chart when there is no path to draw), in light colours for paper, the same charts the
command line's <code>tauscope batch</code> puts in. <b>File → Save study</b> (<b>Ctrl+S</b>)
keeps the workbooks, series, settings and findings in a <code>.tauscope</code> file; opening it
later reads the workbooks again, tells you if one changed or moved, and analyses the series again
to the same numbers.</p>
<p>Right-click a series to add a transformed copy: natural log, first difference, growth in %
(log difference × 100) or seasonal difference. The copy appears under the series it came from.</p>""",
    "sequence": """
<p>A series with a <i>unit root</i> wanders without returning to a fixed mean or trend; shocks
to it are permanent. Regressions on such series can show relations that are not there
(spurious regression), so applied work first settles how often each series must be differenced
to become stationary: its <i>order of integration</i>, I(0), I(1) or I(2).</p>
<p>The Augmented Dickey-Fuller (ADF) regression is</p>
<p style='margin-left:2em'>Δy<sub>t</sub> = a<sub>0</sub> + a<sub>2</sub>·t + γ·y<sub>t−1</sub>
+ Σ β<sub>i</sub> Δy<sub>t−i</sub> + e<sub>t</sub></p>
<p>and a unit root means γ = 0 (Dickey &amp; Fuller 1979; Said &amp; Dickey 1984). Which
deterministic terms belong (constant a<sub>0</sub>, trend a<sub>2</sub>) matters: leaving out a
term that belongs makes the test lose power, adding one that does not costs power as well. Tauscope
therefore follows the sequence of Dolado, Jenkinson &amp; Sosvilla-Rivero (1990):</p>
<ol>
<li>Start with constant and trend and test γ = 0 with τ. If τ rejects, there is no unit root;
the trend's own t statistic then says whether the series is stationary around a trend or around
a mean.</li>
<li>If τ does not reject, Φ3 asks whether the trend belongs. If it does, γ = 0 is tested
against the standard normal (z), and the sequence stops.</li>
<li>Otherwise drop the trend: τ with a constant only; if it does not reject, Φ1 asks whether a
drift belongs (then z again), otherwise</li>
<li>drop the constant as well and test τ without deterministic terms.</li>
</ol>
<p>The order of integration is found from the highest difference down (Dickey &amp; Pantula
1987): the sequence runs on the second difference, then the first, then the levels, and stops at
the first difference level where a unit root is not rejected. Finally the KPSS test, which
starts from the opposite null, cross-checks the verdict.</p>""",
    "strategy": f"""
<p>Each step of the classic sequence tests at the chosen level on its own, so over a whole
decision a series with a unit root is called stationary far more often than that level: on the
verdict scorecard (known processes, 500 series per cell, 50 to 500 observations) the classic
sequence called random walks stationary 15–21% of the time with AIC lags and 10–13% with the
modified AIC, at a nominal 5%.</p>
<p>The <b>Size-controlled</b> strategy, the default, decides instead with the union of rejections
(Harvey, Leybourne &amp; Taylor 2009, 2012): four unit-root tests, the Dickey-Fuller t on the
series with its mean or trend removed by GLS (Elliott, Rothenberg &amp; Stock 1996) and the MSB
statistic (Stock 1999; Perron &amp; Ng 1996, with the long-run variance of Ng &amp; Perron 2001) on
the series with them removed by OLS, each against its own critical value scaled by a constant κ,
simulated at the series' length, so that the whole decision on each difference keeps the chosen
level. On the levels of a series of fewer than {SHORT_LENGTH} observations the lag order is at least
{SHORT_MIN_LAG} and the critical values are simulated with the lag choice included, because short series with a
negative moving average otherwise look stationary too often. The steps are marked <b>DF-GLS</b>,
<b>MSB</b> (small values speak against a unit root), <b>M</b> (the union against κ) and
<b>z<sub>λ</sub></b>: whether the series has a trend (or, with a unit root, a
drift) comes from the trend test of Harvey, Leybourne &amp; Taylor (2007), which holds with or
without a unit root. The scorecard measures random walks called stationary 3.0–5.8% of the time.
The price is some power against stationary series whose root is close to one, mostly around a
trend: at 100 observations, AR(1) series around a trend got the right order 30% of the time
(51% with the classic sequence). Below 100 observations the price is higher: at 50, random walks
were called I(2) 15% of the time and AR(1) series with root 0.5 around a mean were called
stationary only 41% of the time (at 30 observations, with root 0.3, 18%): there a verdict of a
unit root is weak evidence of one.</p>
<p>The classic sequence is always computed and shown after the size-controlled steps; when the
two disagree, the Reading says so and which to trust. Choose <b>Classic Dickey-Fuller
sequence</b> in Settings to let it decide.</p>
<p><b>Size-controlled, robust to changing volatility</b> runs the same four tests but judges
them against a critical value from the wild bootstrap (Smeekes &amp; Taylor 2012, after Cavaliere
&amp; Taylor 2008) instead of the constant κ: the series' own shocks, each kept at its date and
given a random sign, build 499 series with a unit root, and the union's statistic must be larger
than all but 5% of theirs (the step <b>M</b> shows the bootstrap value q* and p-value). κ assumes
the shocks keep the same size over the sample; when their size changes, for instance when a
market calms down, the chance of calling a unit root stationary is no longer guaranteed. On the
scorecard the bootstrap called random walks whose shock variance triples, or falls to a third,
halfway stationary 2.4–5.8% of the time (κ: 2.4–6.4%; a change halfway moves κ little), and it
takes about fifteen times as long per series. Whatever the strategy, the size of the shocks is
tested for a change (the κ2 test of Sansó, Aragó &amp; Carrion 2004); when one is found, the
Reading says so, suggests this strategy under the other two, and the verdict is not marked as
agreed.</p>
<p>The <b>Cross-check</b> of a size-controlled verdict is "agrees" only when all of this holds:
KPSS backs it strictly (no rejection even at 10% where none is expected, a rejection at 1% where
one is), the classic sequence gives the same order, the verdict is the same at 1% and at 10% and
with a longer maximum lag, the test had at least 90% power at this length against a stationary
series with root 0.95 (for a unit-root verdict), there are at least 150 observations (1,051 for
a unit root without drift, enough to see a drift of a tenth of the shocks' size per period), no
break is suspected, the size of the shocks does not change over the sample, no seasonal unit
root is found (quarterly and monthly series), and, for a stationary verdict, the changes of the
series do not alternate so strongly (first autocorrelation of the changes below
{MA_CANCEL_BELOW_TEXT}) that a unit root whose moving average nearly cancels it would look the
same: there the tests cannot tell the two apart. Whatever the strategy, a seasonal unit root
keeps the verdict from "agrees", and the Reading says why in plain words. On the
scorecard such verdicts were right 98.1% of the time overall (order and deterministic terms)
and at least 95% in every case measured; about 1 in 10 verdicts qualified. Without the last
condition, all 20 confirmed verdicts in one case (a unit root with a strong negative moving
average, 150 observations) were wrong. The price: a stationary series with little memory is
never marked "agrees".
The old rule (KPSS alone) was right 71.0% of the time.</p>""",
    "tau": """
<p><b>τ (tau)</b> is the t ratio of γ̂ in the ADF regression. Under a unit root it does not
follow Student's t: its distribution is shifted to the left and depends on the deterministic
terms (Dickey &amp; Fuller 1979). Tauscope compares it with MacKinnon's (1996, 2010) response-
surface critical values for the sample size at hand. Strongly negative values are evidence
against a unit root; τ below the critical value rejects.</p>""",
    "phi": """
<p>The <b>Φ</b> statistics (Dickey &amp; Fuller 1981) are F tests of restrictions that combine
the unit root with the deterministic terms, computed by comparing the restricted and unrestricted
regressions on the same sample and lags:</p>
<ul><li><b>Φ1</b>: a<sub>0</sub> = γ = 0 (unit root without drift), in the regression with a
constant;</li>
<li><b>Φ2</b>: a<sub>0</sub> = a<sub>2</sub> = γ = 0, in the regression with constant and trend;</li>
<li><b>Φ3</b>: a<sub>2</sub> = γ = 0 (unit root without trend), in the regression with constant
and trend.</li></ul>
<p>They have their own non-standard critical values; a large value rejects, meaning the
deterministic term belongs in the regression.</p>""",
    "z": """
<p>When a unit root is not rejected but a trend or a drift clearly belongs, the unit-root t ratio
is asymptotically normal (West 1988), so the sequence tests γ = 0 once more against the
standard normal. The label <b>z</b> marks these steps.</p>""",
    "kpss": """
<p>The KPSS test (Kwiatkowski, Phillips, Schmidt &amp; Shin 1992) starts from the opposite null:
the series is stationary (around a mean or a trend). Rejecting points to a unit root. Tauscope
runs it on the levels and the differences the verdict concerns, with the other cross-checks
turned on in Settings, and the Cross-check column says what they make of the verdict:</p>"""
    + _cross_check_list() + """
<p>Disagreement is common with short spans or persistent but stationary series; read the verdict
with care then.</p>""",
    "lags": """
<p>The lagged differences Σ β<sub>i</sub> Δy<sub>t−i</sub> soak up short-run dynamics so that
the errors are white noise (Said &amp; Dickey 1984). Too few lags distort τ; too many cost power.
The lag order is chosen by the rule in Settings, comparing all orders on a common sample
(Ng &amp; Perron 1995): AIC, BIC or HQC information criteria, a general-to-specific t test on the
last lag, or the modified AIC of Ng &amp; Perron (2001), which behaves better when the series has
a large negative moving-average part. The search runs from 0 up to Schwert's (1989) maximum
12·(T/100)<sup>¼</sup> unless you set another. The chosen regression is then re-estimated on the
longest sample available. The size-controlled strategy's four tests take the modified AIC whatever
rule you choose (Ng &amp; Perron built it for them; a fixed order is kept), up to 6·(T/100)<sup>¼</sup>
on the levels and 4·(T/100)<sup>¼</sup> on the differences; your rule drives the classic sequence
and the cross-checks.</p>""",
    "critical": """
<p>A <b>critical value</b> is the threshold the statistic must pass for the step to reject at the
chosen significance level. For τ it is negative (reject when τ is below it); for the Φ tests and
KPSS it is positive (reject when the statistic is above it). Tauscope uses finite-sample values
for the length of the series (MacKinnon 1996, 2010).</p>""",
    "pvalues": """
<p>The <b>p-value</b> is the chance of a statistic at least this extreme if the null hypothesis
were true. Small p-values are evidence against the null. Where a published table only bounds the
p-value (KPSS), Tauscope says so in words: "below 0.01" or "above 0.10".</p>""",
    "decisions": """
<p><b>Rejected</b> means the data give evidence against the null hypothesis at the chosen level.
<b>Not rejected</b> means no evidence against it was found, which is not proof that it holds:
unit-root tests have low power against stationary series that are very persistent, against
short spans of years, and against series with a break (Perron 1989).</p>""",
    "verdicts": """
<ul><li><b>I(0): stationary</b> around a mean, a trend or zero. Use the series in levels
(with a trend term if the verdict says so).</li>
<li><b>I(1): one unit root</b>, with drift, with drift and trend, or without drift. Suggestion:
difference once before using it in a regression, or model it with cointegration.</li>
<li><b>I(2): two unit roots.</b> Suggestion: difference twice, or check whether logs or growth
rates are the better unit.</li>
<li><b>Unresolved</b>: a unit root was not rejected even at the highest difference allowed;
check the data.</li>
<li><b>Not tested</b>: the series could not be tested (too short, constant, gaps); the reason is
given.</li></ul>
<p>Each verdict carries a shape (circle, triangle, square, diamond, cross) so the verdicts can be
told apart without colour. On the steps below a series, the same column (“Verdict · null
tested”) shows the null hypothesis each step tests.</p>""",
    "regression": """
<p>Under every step of the decision path the regression behind it is shown: the number of
observations used, the lag order and how it was chosen, and each coefficient with its estimate,
standard error and t ratio. The t ratios of the lag terms have the usual distribution; the t ratio
of y(t−1) is τ and does not.</p>""",
    "statistics": """
<p>τ tests for a unit root; Φ1, Φ2 and Φ3 test a unit root together with deterministic terms;
z is the unit-root t ratio against the normal when a trend or drift belongs; KPSS tests
stationarity. See the sections above for each.</p>""",
    "chart-data": """
<p>The series as read and its first difference below, on a shared date axis. Drag to pan, wheel
to zoom; right-click any chart to save it as a picture (PNG)
or a drawing (SVG). Long series stay smooth because only the visible part is drawn,
thinned to the screen's resolution.</p>""",
    "chart-fitted": """
<p>The tested series with the deterministic path its verdict implies: the mean or the trend for a
stationary series, the drift line for a series with a unit root and drift. A series that strays
far from its path for long stretches deserves a second look (a break, or a different unit).</p>""",
    "chart-lags": """
<p>τ computed with every lag order from 0 to the maximum, with the critical value as a dashed
line and the chosen lag order marked. If τ crosses the line as the lag order changes, the
decision depends on the lag choice and deserves care.</p>""",
    "pp": """
<p>The <b>Phillips-Perron</b> test (Phillips &amp; Perron 1988) asks the same question as τ but
handles autocorrelated errors differently: instead of adding lagged differences to the
regression, it corrects the Dickey-Fuller t ratio with an estimate of the long-run variance
(Newey-West, with a bandwidth chosen from the data). Its Zτ uses the same critical values as τ.
Where it and the ADF test disagree, the verdict depends on how the short-run dynamics are
handled; read it as tentative. Turn it on under Settings → Cross-checks.</p>""",
    "dfgls": """
<p><b>DF-GLS</b> (Elliott, Rothenberg &amp; Stock 1996) first removes the mean or the trend by a
quasi-difference (GLS) regression, then runs the Dickey-Fuller regression on what is left. It
rejects a false unit root more often than the ADF test with the same data, especially when the
series is very persistent. The lag order is chosen by the modified AIC unless you fixed it.</p>""",
    "za": """
<p>A one-time shift in the level or the slope of a series makes the ADF test see a unit root where
there is none (Perron 1989). The <b>Zivot-Andrews</b> test (Zivot &amp; Andrews 1992) allows one
break in the intercept, the trend or both, at the date where the evidence against a unit root is
strongest, and reports that date. If it rejects while the ADF test does not, look at the source
near the break date: a change of definition, a crisis, a new base year. Its critical values are
more negative than τ's, because the break date was chosen from the data.</p>""",
    "exact": """
<p>Published critical values (MacKinnon 1996, 2010) are response surfaces fitted over many
sample sizes. With <b>exact critical values</b> Tauscope simulates the distribution of each
statistic under a unit root at your series' own length, with a fixed seed so the numbers repeat,
and takes the critical values and p-values from the simulation. This is slower (the first run
for a new length takes a few seconds) and matters most for short series.</p>""",
    "power": """
<p>Not rejecting a unit root is weak evidence when the test rarely rejects anyway. With
<b>power</b> turned on, Tauscope simulates stationary series of your length whose autoregressive
coefficient is 0.90 and 0.95 and reports how often the last ADF test of the classic sequence
would reject a unit root (under the classic strategy it is the test that decided; under the
size-controlled strategies the verdict rests on DF-GLS and MSB instead, whose measured rates are
in the scorecard of the section on the testing sequence). A power of 30% means seven times in
ten a stationary series this persistent would also have looked like a unit root: the verdict
then rests on little.</p>""",
    "chart-recursive": """
<p>The ADF τ of the classic sequence's last step recomputed on an expanding window: the first
part of the series, then a little more, up to all of it, with the critical value for each window
length as a dashed line. Under the size-controlled strategies this ADF test is a cross-check, not
the test that decided the verdict. A τ that crosses the
line and stays there shows when the evidence settled; one that wanders across it several times
says the verdict depends on the span, often because of a break.</p>""",
    "chart-null": """
<p>The distribution of τ when the series truly has a unit root, simulated for this regression
and sample size, drawn against the standard normal. It shows why τ needs its own critical values:
the simulated distribution lies well to the left of the normal. The observed τ and the critical
value are marked.</p>""",
    "seasons": """
<p>A quarterly or monthly series (Tauscope knows from its dates) often has a <i>seasonal
pattern</i>. Two kinds matter for unit-root tests, and the Reading names each when it is there.</p>
<p><b>Fixed seasonal means</b>: each quarter or month has its own average level, the same every
year. Left in, they mislead the Dickey-Fuller tests: the lagged changes soak them up and a
stationary series looks like one with a unit root (on the verdict scorecard a monthly AR(1) with
φ = 0.5 and fixed monthly means was called stationary only 44% of the time at 100 observations by
the classic sequence with AIC lags). Tauscope tests for them with an F test of seasonal dummies
in the Dickey-Fuller regression of the changes (with a constant, the previous level and lagged
changes), and when it finds them at 1% it removes each season's mean before every unit-root test
(the same as seasonal dummies in the regression; Dickey, Bell &amp; Miller 1986). The
size-controlled decision's constants are then simulated with the same removal at the series'
length. The Reading says whether they were found, with the F test, and the result keeps each
season's effect. <b>Seasonal means</b> in Settings: <i>when a fixed seasonal pattern is found</i>
(the default), <i>always</i>, or <i>never</i> (no seasonal part at all).</p>
<p><b>Seasonal unit roots</b>: the seasonal pattern itself wanders from year to year instead of
repeating around fixed means. Tauscope tests for them with the HEGY test (Hylleberg, Engle,
Granger &amp; Yoo 1990) for quarterly series and the Beaulieu-Miron test (Beaulieu &amp; Miron
1993) for monthly ones, with seasonal dummies and critical values simulated at the series'
length. Each cycle is named in plain words: <i>twice a year</i>, <i>once a year</i> (for
quarters), and for months also three to six times a year. When a seasonal unit root is found the
Reading suggests a seasonal difference (each quarter or month minus the same one a year earlier;
right-click the series to add that copy), or, when the long run is already stable, a filter that
removes only the seasonal roots found; the tests of the order do not allow for such roots, so
the verdict is then not marked as agreed. KPSS and the other cross-checks see the series with
its fixed seasonal means removed whenever the unit-root tests do. The <b>Seasons</b> chart draws
one line per quarter or month across the years, each year's average removed: with fixed seasonal
means the lines run roughly parallel; with a seasonal unit root they wander and cross.</p>""",
    "settings": """
<p><b>Verdict decided by</b>: size-controlled (the default) or the classic Dickey-Fuller
sequence; see "How the verdict is decided". <b>Seasonal means</b> (quarterly and monthly series):
allow for fixed seasonal means when a test finds them (the default), always, or never; see
"Seasons".
<b>Significance level</b>: 1%, 5% or 10%, used for every test in the sequence.
<b>Lag rule</b> and <b>largest lag order</b>: see Lag order above.
<b>Highest difference</b>: where the sequence starts (2 allows I(2) verdicts).
<b>Cross-checks</b>: KPSS (stationarity as the null), Phillips-Perron, DF-GLS and Zivot-Andrews
(with the break in the intercept, the trend or both). <b>Critical values</b>: the published
ones, or exact ones simulated at your sample size (slower). <b>Power</b>: whether the power of
the deciding test is simulated and reported. <b>Break check</b>: when a large jump, KPSS at odds
with the verdict or a large swing of τ points to a break, test for a level shift that is allowed
under both hypotheses (Lee &amp; Strazicich 2013) and give the verdict under it (the default), or
<i>off</i>. Settings are remembered between sessions.</p>""",
    "references": """
<ul>
<li>Dickey, D.A. &amp; Fuller, W.A. (1979). Distribution of the estimators for autoregressive time
series with a unit root. <i>Journal of the American Statistical Association</i> 74, 427–431.</li>
<li>Dickey, D.A. &amp; Fuller, W.A. (1981). Likelihood ratio statistics for autoregressive time
series with a unit root. <i>Econometrica</i> 49, 1057–1072.</li>
<li>Beaulieu, J.J. &amp; Miron, J.A. (1993). Seasonal unit roots in aggregate U.S. data.
<i>Journal of Econometrics</i> 55, 305–328.</li>
<li>Dickey, D.A., Bell, W.R. &amp; Miller, R.B. (1986). Unit roots in time series models: tests
and implications. <i>The American Statistician</i> 40, 12–26.</li>
<li>Dickey, D.A. &amp; Pantula, S.G. (1987). Determining the order of differencing in
autoregressive processes. <i>Journal of Business &amp; Economic Statistics</i> 5, 455–461.</li>
<li>Dolado, J.J., Jenkinson, T. &amp; Sosvilla-Rivero, S. (1990). Cointegration and unit roots.
<i>Journal of Economic Surveys</i> 4, 249–273.</li>
<li>Elliott, G., Rothenberg, T.J. &amp; Stock, J.H. (1996). Efficient tests for an
autoregressive unit root. <i>Econometrica</i> 64, 813–836.</li>
<li>Harvey, D.I., Leybourne, S.J. &amp; Taylor, A.M.R. (2007). A simple, robust and powerful test
of the trend hypothesis. <i>Journal of Econometrics</i> 141, 1302–1330.</li>
<li>Harvey, D.I., Leybourne, S.J. &amp; Taylor, A.M.R. (2009). Unit root testing in practice:
dealing with uncertainty over the trend and initial condition. <i>Econometric Theory</i> 25,
587–636.</li>
<li>Harvey, D.I., Leybourne, S.J. &amp; Taylor, A.M.R. (2012). Testing for unit roots in the
presence of uncertainty over both the trend and initial condition. <i>Journal of Econometrics</i>
169, 188–195.</li>
<li>Hylleberg, S., Engle, R.F., Granger, C.W.J. &amp; Yoo, B.S. (1990). Seasonal integration and
cointegration. <i>Journal of Econometrics</i> 44, 215–238.</li>
<li>Kwiatkowski, D., Phillips, P.C.B., Schmidt, P. &amp; Shin, Y. (1992). Testing the null
hypothesis of stationarity against the alternative of a unit root. <i>Journal of Econometrics</i>
54, 159–178.</li>
<li>MacKinnon, J.G. (1996). Numerical distribution functions for unit root and cointegration
tests. <i>Journal of Applied Econometrics</i> 11, 601–618.</li>
<li>MacKinnon, J.G. (2010). Critical values for cointegration tests. Queen's Economics
Department Working Paper 1227.</li>
<li>Ng, S. &amp; Perron, P. (1995). Unit root tests in ARMA models with data-dependent methods
for the selection of the truncation lag. <i>Journal of the American Statistical Association</i>
90, 268–281.</li>
<li>Ng, S. &amp; Perron, P. (2001). Lag length selection and the construction of unit root tests
with good size and power. <i>Econometrica</i> 69, 1519–1554.</li>
<li>Perron, P. (1989). The great crash, the oil price shock, and the unit root hypothesis.
<i>Econometrica</i> 57, 1361–1401.</li>
<li>Phillips, P.C.B. &amp; Perron, P. (1988). Testing for a unit root in time series
regression. <i>Biometrika</i> 75, 335–346.</li>
<li>Said, S.E. &amp; Dickey, D.A. (1984). Testing for unit roots in autoregressive-moving average
models of unknown order. <i>Biometrika</i> 71, 599–607.</li>
<li>Schwert, G.W. (1989). Tests for unit roots: a Monte Carlo investigation. <i>Journal of
Business &amp; Economic Statistics</i> 7, 147–159.</li>
<li>West, K.D. (1988). Asymptotic normality, when regressors have a unit root.
<i>Econometrica</i> 56, 1397–1417.</li>
<li>Zivot, E. &amp; Andrews, D.W.K. (1992). Further evidence on the great crash, the oil-price
shock, and the unit-root hypothesis. <i>Journal of Business &amp; Economic Statistics</i> 10,
251–270.</li>
</ul>""",
}


def guide_html() -> str:
    """The whole guide: a contents list, then every section under its anchor."""
    contents = "".join(f"<li><a href='#{a}'>{t}</a></li>" for a, t in SECTIONS)
    body = "".join(f"<h2><a name='{a}'></a>{t}</h2>{_BODY[a]}" for a, t in SECTIONS)
    return (f"<h1>Tauscope guide</h1><p>How Tauscope decides whether a series has a unit root, "
            f"and how to read what it shows.</p><ul>{contents}</ul>{body}")


ANCHORS = tuple(a for a, _ in SECTIONS)
