using System.CommandLine;
using System.Globalization;
using System.Text.Encodings.Web;
using System.Text.Json;
using System.Text;
using NetAdjust.IO.Project;
using NetAdjust.IO.Text;
using NetAdjust.Network;
using NetAdjust.Stochastic;
using NetAdjust.Units;

namespace NetAdjust.Cli.Commands;

/// <summary>
/// <c>netadjust budget distance|direction|angle|level [options]</c>: the error budget of one measurement from
/// instrument, target and procedure specifications. Prints each contribution and the total in the user's units,
/// or JSON with <c>--json</c>. Bad specifications exit with <see cref="ExitCodes.InvalidInput"/>.
/// </summary>
internal static class BudgetCommand
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static Command Create(CliConsole console)
    {
        var cmd = new Command("budget",
            "Compute the error budget (a-priori standard deviation and its contributions) of a single measurement.");
        cmd.Subcommands.Add(Distance(console));
        cmd.Subcommands.Add(Direction(console, angle: false));
        cmd.Subcommands.Add(Direction(console, angle: true));
        cmd.Subcommands.Add(Level(console));
        return cmd;
    }

    private static Option<string?> Text(string name, string description, string helpName) =>
        new(name) { Description = description, HelpName = helpName };

    private sealed record Common(Option<string?> Units, Option<string?> AngleUnits, Option<bool> Json);

    private static Common AddCommon(Command c)
    {
        var common = new Common(
            Text("--units",
                "Unit of bare lengths in the options and of the printed lengths: m (default), ft (international " +
                "foot) or usft (US survey foot).", "m|ft|usft"),
            Text("--angle-units", "Unit of angular standard deviations, in and out: arcsec (default) or mgon.",
                "arcsec|mgon"),
            new Option<bool>("--json") { Description = "Print the budget as JSON for machines." });
        c.Options.Add(common.Units);
        c.Options.Add(common.AngleUnits);
        c.Options.Add(common.Json);
        return common;
    }

    private static Command Distance(CliConsole console)
    {
        var length = Text("--length", "The horizontal distance (e.g. 250.3 or 820 ft).", "LENGTH");
        var edm = Text("--edm", "EDM specification, e.g. '2 mm + 2 ppm'.", "SPEC");
        var ic = Text("--instrument-centering",
            "Instrument centering standard deviation per axis (e.g. 1 mm); default 0.", "LENGTH");
        var tc = Text("--target-centering", "Target centering standard deviation per axis (e.g. 2 mm); default 0.",
            "LENGTH");
        var c = new Command("distance",
            "Budget of an EDM distance: constant and proportional EDM parts, instrument and target " +
            "centering.") { length, edm, ic, tc };
        var common = AddCommon(c);
        c.SetAction(p => CommandRunner.Guard(console, () =>
        {
            var unit = LengthUnitOf(p.GetValue(common.Units));
            double d = RequiredLength(p.GetValue(length), "--length", unit, positive: true);
            string specText = p.GetValue(edm) ??
                throw new InvalidInputException("--edm is required, e.g. --edm \"2 mm + 2 ppm\"");
            var spec = EdmSpecification.Parse(specText, unit);
            if (!spec.Success) throw new InvalidInputException($"--edm: {spec.Error}");
            var ts = new TotalStationSpecification("(command line)", Angle.FromRadians(1.0), Angle.Zero, spec.Value,
                Length.FromMetres(OptionalLength(p.GetValue(ic), "--instrument-centering", unit)), Length.Zero);
            var target = new TargetSpecification("(command line)",
                Length.FromMetres(OptionalLength(p.GetValue(tc), "--target-centering", unit)), Length.Zero);
            var budget = DistanceBudgetBuilder.Build(ts, target, d);
            string title =
                $"horizontal distance {Fmt(Length.FromMetres(d).In(unit), 4)} {unit.Symbol}, EDM {specText.Trim()}";
            return Print(console, p.GetValue(common.Json), "distance", title, budget, unit.Symbol,
                1.0 / unit.MetresPerUnitExact(), 5);
        }));
        return c;
    }

    private static Command Direction(CliConsole console, bool angle)
    {
        var iso = Text("--direction-sd",
            "ISO 17123-3 standard deviation of a direction observed once in both faces (in --angle-units).", "SD");
        var sets = Text("--sets", "Number of sets averaged; default 1.", "N");
        var faces = Text("--faces", "Faces observed in each set: both (default) or one.", "both|one");
        var ic = Text("--instrument-centering",
            "Instrument centering standard deviation per axis (needs the sight lengths); default 0.", "LENGTH");
        var tc = Text("--target-centering",
            "Target centering standard deviation per axis (needs the sight lengths); default 0.", "LENGTH");
        var c = new Command(angle ? "angle" : "direction", angle
            ? "Budget of a horizontal angle (difference of two directions): pointing and reading from the ISO sd, " +
                "sets and faces; centering of instrument and targets."
            : "Budget of a horizontal direction: pointing and reading from the ISO sd, sets and faces; centering of " +
                "instrument and target.")
        { iso, sets, faces, ic, tc };
        Option<string?> length = Text("--length", "The sight length (needed for centering).", "LENGTH");
        Option<string?> back = Text("--backsight", "The backsight length (needed for centering).", "LENGTH");
        Option<string?> fore = Text("--foresight", "The foresight length (needed for centering).", "LENGTH");
        Option<string?> value =
            Text("--angle",
            "The angle, clockwise from backsight to foresight, in DMS (e.g. 95-30-00) (needed for instrument " +
            "centering).", "D-M-S");
        if (angle) { c.Options.Add(back); c.Options.Add(fore); c.Options.Add(value); }
        else c.Options.Add(length);
        var common = AddCommon(c);
        c.SetAction(p => CommandRunner.Guard(console, () =>
        {
            var unit = LengthUnitOf(p.GetValue(common.Units));
            var au = AngleUnitOf(p.GetValue(common.AngleUnits));
            double perUnit = au.RadiansPerUnit();
            double sd = RequiredNumber(p.GetValue(iso), "--direction-sd", positive: true) * perUnit;
            var procedure = new ObservingProcedure(Count(p.GetValue(sets), "--sets", 1000), FacesOf(p.GetValue(faces)));
            double ci = OptionalLength(p.GetValue(ic), "--instrument-centering", unit), ct =
                OptionalLength(p.GetValue(tc), "--target-centering", unit);
            var ts = new TotalStationSpecification("(command line)", Angle.FromRadians(sd), Angle.Zero, null,
                Length.FromMetres(ci), Length.Zero);
            var target = new TargetSpecification("(command line)", Length.FromMetres(ct), Length.Zero);
            string proc =
                $"{procedure.Sets} set{(procedure.Sets == 1 ? "" : "s")}, " +
                $"{(procedure.Faces == Faces.Both ? "both faces" : "one face")}";
            string iso1 = $"ISO sd {Fmt(sd / perUnit, 2)} {au.Symbol()}";
            ErrorBudget budget;
            string title;
            if (!angle)
            {
                string? lt = p.GetValue(length);
                if (lt is null && (ci > 0 || ct > 0))
                    throw new InvalidInputException("--length is needed to count centering errors");
                budget = lt is null
                    ? new ErrorBudget([new(ContributionNames.PointingReading,
                        Quantity.Of(DirectionBudgetBuilder.PointingReading(Angle.FromRadians(sd), procedure)))])
                    : DirectionBudgetBuilder.Build(ts, target, procedure,
                        RequiredLength(lt, "--length", unit, positive: true));
                title = $"horizontal direction, {iso1}, {proc}";
            }
            else
            {
                string? bt = p.GetValue(back), ft = p.GetValue(fore), at = p.GetValue(value);
                bool geometry = bt is not null || ft is not null || at is not null;
                if (!geometry && (ci > 0 || ct > 0))
                    throw new InvalidInputException(
                        "--backsight, --foresight and --angle are needed to count centering errors");
                if (geometry)
                {
                    if (bt is null || ft is null || at is null)
                        throw new InvalidInputException("give all of --backsight, --foresight and --angle, or none");
                    var a = AnglePattern.Dms.Parse(at);
                    if (!a.Success) throw new InvalidInputException($"--angle: {a.Error}");
                    budget = AngleBudgetBuilder.Build(ts, target, target, procedure, RequiredLength(bt, "--backsight",
                        unit, positive: true),
                        RequiredLength(ft, "--foresight", unit, positive: true), a.Value);
                }
                else budget = new ErrorBudget([new(ContributionNames.PointingReading, Quantity.Of(Math.Sqrt(2.0) *
                    DirectionBudgetBuilder.PointingReading(Angle.FromRadians(sd), procedure)))]);
                title = $"horizontal angle, {iso1}, {proc}";
            }
            return Print(console, p.GetValue(common.Json), angle ? "angle" : "direction", title, budget, au.Symbol(),
                1.0 / perUnit, 2);
        }));
        return c;
    }

    private static Command Level(CliConsole console)
    {
        var perKm = Text("--per-km", "ISO 17123-2 standard deviation of 1 km double-run levelling (e.g. 0.7 mm).",
            "LENGTH");
        var length = Text("--length", "Length of the levelling line (e.g. 2.4 km or 2400), for --per-km.", "LENGTH");
        var reading = Text("--reading-sd", "Standard deviation of one rod reading (e.g. 0.3 mm).", "LENGTH");
        var setups = Text("--setups",
            "Instrument setups in one run (a backsight and a foresight reading each), for --reading-sd.", "N");
        var runs = Text("--runs",
            "Runs meaned: default 2 with --per-km (the ISO figure is for a double run), 1 with --reading-sd.", "N");
        var resolution = Text("--resolution", "Rod reading resolution (e.g. 1 mm), for --reading-sd; default 0.",
            "LENGTH");
        var rounding = Text("--rounding",
            "Rounding error of a reading: uniform (resolution/sqrt(12), GUM; default) or half (half the resolution).",
            "uniform|half");
        var c = new Command("level",
            "Budget of a levelled height difference: per km (ISO 17123-2) or per reading (error of a series of " +
            "readings).")
        { perKm, length, reading, setups, runs, resolution, rounding };
        var common = AddCommon(c);
        c.SetAction(p => CommandRunner.Guard(console, () =>
        {
            var unit = LengthUnitOf(p.GetValue(common.Units));
            string? pk = p.GetValue(perKm), rs = p.GetValue(reading);
            if ((pk is null) == (rs is null))
                throw new InvalidInputException("give either --per-km (with --length) or --reading-sd (with --setups)");
            ErrorBudget budget;
            string title;
            if (pk is not null)
            {
                foreach (var (o, n) in new[] { (setups, "--setups"), (resolution, "--resolution"),
                    (rounding, "--rounding") })
                    if (p.GetValue(o) is not null)
                        throw new InvalidInputException($"{n} belongs to the per-reading model (--reading-sd)");
                var level = LevelSpecification.PerKm("(command line)", Length.FromMetres(RequiredLength(pk, "--per-km",
                    unit, positive: true)));
                double l = RequiredLength(p.GetValue(length), "--length", unit, positive: true);
                int r = Count(p.GetValue(runs), "--runs", 100, 2);
                budget = HeightDifferenceBudgetBuilder.Build(level, l, new LevellingProcedure(1, r));
                title =
                    $"levelling line {Fmt(l / 1000, 3)} km, {r} run{(r == 1 ? "" : "s")}, " +
                    $"{Fmt(level.StandardDeviationPerKm!.Value.In(unit), 5)} {unit.Symbol} per km (ISO 17123-2)";
            }
            else
            {
                if (p.GetValue(length) is not null)
                    throw new InvalidInputException(
                        "--length belongs to the per-km model (--per-km); give --setups with --reading-sd");
                string? rt = p.GetValue(rounding);
                var treatment = CliChoice.Parse(rt, "--rounding", OptionGrammars.Rounding, RoundingTreatment.Uniform);
                var level = LevelSpecification.PerReading("(command line)", Length.FromMetres(RequiredLength(rs,
                    "--reading-sd", unit, positive: false)),
                    Length.FromMetres(OptionalLength(p.GetValue(resolution), "--resolution", unit)), treatment);
                if (p.GetValue(setups) is null)
                    throw new InvalidInputException("--setups is required with --reading-sd");
                var proc = new LevellingProcedure(Count(p.GetValue(setups), "--setups", 100000), Count(p.GetValue(runs),
                    "--runs", 100));
                budget = HeightDifferenceBudgetBuilder.Build(level, null, proc);
                title =
                    $"levelling line, {proc.Setups} setup{(proc.Setups == 1 ? "" : "s")} ({proc.Readings} readings) " +
                    $"per run, {proc.Runs} run{(proc.Runs == 1 ? "" : "s")}";
            }
            return Print(console, p.GetValue(common.Json), "height_difference", title, budget, unit.Symbol,
                1.0 / unit.MetresPerUnitExact(), 5);
        }));
        return c;
    }

    private static int Print(CliConsole console, bool json, string kind, string title, ErrorBudget budget, string unit,
        double factor, int decimals)
    {
        if (json)
        {
            using var ms = new MemoryStream();
            using (var w = new Utf8JsonWriter(ms, new JsonWriterOptions { Indented = true, Encoder =
                JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
            {
                w.WriteStartObject();
                w.WriteString("kind", kind);
                w.WriteString("unit", unit);
                w.WriteStartObject("sd_components");
                foreach (var c in budget.Contributions) w.WriteNumber(c.Name, Si(c.Sd) * factor);
                w.WriteEndObject();
                w.WriteNumber("sd", Si(budget.TotalSd) * factor);
                w.WriteEndObject();
            }
            console.Out.Write(Encoding.UTF8.GetString(ms.ToArray()) + "\n");
            return ExitCodes.Success;
        }
        console.Out.WriteLine($"Error budget: {title}");
        double total = Si(budget.TotalSd);
        foreach (var c in budget.Contributions)
            console.Out.WriteLine(
                $"  {c.Name,-24} {Fmt(Si(c.Sd) * factor, decimals),12} {unit}  " +
                $"{Fmt(100 * Math.Pow(Si(c.Sd) / total, 2), 1),5} % of variance");
        console.Out.WriteLine($"  {"total",-24} {Fmt(total * factor, decimals),12} {unit}  (root-sum-square)");
        return ExitCodes.Success;
    }

    /// <summary>A budget's value in SI units (radians for an angle, metres for a length), scaled by the caller.
    /// </summary>
    private static double Si(Quantity q) => q.AsAngle?.Radians ?? q.AsLength!.Value.Metres;

    private static string Fmt(double v, int decimals) => v.ToString("F" + decimals, Inv);

    private static double MetresPerUnitExact(this LengthUnit u) => Length.From(1.0, u).Metres;

    private static LengthUnit LengthUnitOf(string? s) =>
        CliChoice.Parse(s, "--units", OptionGrammars.LengthUnits, LengthUnit.Metre);

    private static AngleSdUnit AngleUnitOf(string? s) =>
        CliChoice.Parse(s, "--angle-units", OptionGrammars.AngleSdUnits, AngleSdUnit.Arcsecond);

    private static Faces FacesOf(string? s) => CliChoice.Parse(s, "--faces", OptionGrammars.Faces, Faces.Both);

    private static double RequiredLength(string? text, string name, LengthUnit unit, bool positive)
    {
        if (text is null) throw new InvalidInputException($"{name} is required");
        var r = new LengthPattern(unit, 4).Parse(text);
        if (!r.Success) throw new InvalidInputException($"{name}: {r.Error}");
        if (positive ? !(r.Value.Metres > 0) : r.Value.Metres < 0)
            throw new InvalidInputException(
                $"{name} must be {(positive ? "positive" : "zero or positive")}, not '{text}'");
        return r.Value.Metres;
    }

    private static double OptionalLength(string? text, string name, LengthUnit unit) =>
        text is null ? 0 : RequiredLength(text, name, unit, positive: false);

    private static double RequiredNumber(string? text, string name, bool positive)
    {
        if (text is null) throw new InvalidInputException($"{name} is required");
        if (!double.TryParse(text, NumberStyles.Float, Inv, out double v) || !double.IsFinite(v))
            throw new InvalidInputException($"{name}: '{text}' is not a number");
        if (positive && !(v > 0)) throw new InvalidInputException($"{name} must be positive, not '{text}'");
        return v;
    }

    private static int Count(string? text, string name, int max, int fallback = 1)
    {
        if (text is null) return fallback;
        return int.TryParse(text, NumberStyles.None, Inv, out int n) && n >= 1 && n <= max ? n
            : throw new InvalidInputException($"{name} '{text}' must be a whole number from 1 to {max}");
    }
}
