using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Diagnosis;

/// <summary>Copies of an observation with one booked item changed (value, target or instrument height, target
/// point), everything else kept: the corrected observations a diagnosis re-adjusts.</summary>
internal static class ObservationEdits
{
    /// <summary>The observation with a new SI value (angles of directions, angles and azimuths reduced to
    /// [0, 2π); of a GNSS baseline component, that component alone); its booked text dropped unless given.</summary>
    public static Observation WithValue(Observation o, double value, string? booked = null)
    {
        Observation x = o switch
        {
            DistanceObservation d => d with { Distance = Length.FromMetres(value) },
            DirectionObservation d => d with { Reading = Angle.FromRadians(Angle.Reduce0To2Pi(value)) },
            AngleObservation a => a with { Measured = Angle.FromRadians(Angle.Reduce0To2Pi(value)) },
            AzimuthObservation a => a with { Azimuth = Angle.FromRadians(Angle.Reduce0To2Pi(value)) },
            HeightDifferenceObservation h => h with { Difference = Length.FromMetres(value) },
            SlopeDistanceObservation s => s with { Distance = Length.FromMetres(value) },
            ZenithObservation z => z with { Zenith = Angle.FromRadians(value) },
            // a baseline component: only this component's value (the other two are observations of their own)
            BaselineObservation b => b.Component switch
            {
                BaselineComponent.X => b with { Dx = Length.FromMetres(value) },
                BaselineComponent.Y => b with { Dy = Length.FromMetres(value) },
                _ => b with { Dz = Length.FromMetres(value) },
            },
            _ => throw new ArgumentOutOfRangeException(nameof(o), o.Kind, "no value edit for this kind"),
        };
        return x with { BookedText = booked };
    }

    /// <summary>A slope distance or zenith angle with its target (or instrument) height changed by
    /// <paramref name="delta"/> metres; other kinds unchanged.</summary>
    public static Observation WithHeight(Observation o, double delta, bool target) => (o, target) switch
    {
        (SlopeDistanceObservation s, true) => s with
        {
            TargetHeight = Length.FromMetres(s.TargetHeight.Metres + delta),
        },
        (SlopeDistanceObservation s, false) => s with
        {
            InstrumentHeight = Length.FromMetres(Math.Max(0, s.InstrumentHeight.Metres + delta)),
        },
        (ZenithObservation z, true) => z with { TargetHeight = Length.FromMetres(z.TargetHeight.Metres + delta) },
        (ZenithObservation z, false) => z with
        {
            InstrumentHeight = Length.FromMetres(Math.Max(0, z.InstrumentHeight.Metres + delta)),
        },
        _ => o,
    };

    /// <summary>True when <see cref="Retarget"/> can move the observation to another point on its own: every kind
    /// but a GNSS baseline component, whose wrong point would move all three components of its baseline
    /// together.</summary>
    public static bool CanRetarget(Observation o) => o.Kind != ObservationKind.Baseline;

    /// <summary>The observation with its target (or an angle's backsight) replaced by another point, everything
    /// else kept (only for kinds where <see cref="CanRetarget"/> holds).</summary>
    public static Observation Retarget(Observation o, string to, bool backsight)
    {
        Observation x = o switch
        {
            DistanceObservation d => new DistanceObservation(d.From, to, d.Distance),
            DirectionObservation d => d with { Target = to },
            AngleObservation a => backsight ? a with { Backsight = to } : a with { Foresight = to },
            AzimuthObservation a => new AzimuthObservation(a.From, to, a.Azimuth),
            HeightDifferenceObservation h => new HeightDifferenceObservation(h.From, to, h.Difference, h.LineLength),
            SlopeDistanceObservation s => new SlopeDistanceObservation(s.From, to, s.Distance, s.InstrumentHeight,
                s.TargetHeight) { PlaneHeight = s.PlaneHeight },
            ZenithObservation z => new ZenithObservation(z.From, to, z.Zenith, z.InstrumentHeight, z.TargetHeight)
            {
                PlaneHeight = z.PlaneHeight, Refraction = z.Refraction, RefractionGroup = z.RefractionGroup,
                RefractionEstimated = z.RefractionEstimated,
            },
            _ => throw new ArgumentOutOfRangeException(nameof(o), o.Kind, "no target edit for this kind"),
        };
        return x with
        {
            StandardDeviation = o.StandardDeviation, Source = o.Source, BookedText = o.BookedText,
            Excluded = o.Excluded, SdFactor = o.SdFactor, Weighting = o.Weighting, SetupId = o.SetupId,
        };
    }
}
