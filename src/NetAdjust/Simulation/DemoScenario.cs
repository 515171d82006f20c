namespace NetAdjust.Simulation;

/// <summary>The invented demonstration surveys of the repository's data/ folder (docs: data/README.md).</summary>
public enum DemoScenario
{
    /// <summary>Brackenmoor water treatment works: a closed traverse of seven stations and a level loop.</summary>
    Brackenmoor,

    /// <summary>Harrowfield quarry extension: a braced network of four new stations with one planted blunder.</summary>
    Harrowfield,

    /// <summary>Harrowgate viaduct: six new stations tied to four control marks, one of them moved by 5 cm.</summary>
    Harrowgate,

    /// <summary>Corvan Fell: a closed 3D traverse in two sets in both faces (rounds), tied to two benchmarks.</summary>
    CorvanFell,

    /// <summary>Tarnholm quarry extension: a braced network on a UTM grid, distances measured on the ground.</summary>
    Tarnholm,

    /// <summary>Skelmoor: four GNSS control marks in two sessions, a traverse between them and a level line, on
    /// ETRS89 / UTM zone 32N.</summary>
    Skelmoor,
}
